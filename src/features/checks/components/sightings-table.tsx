// The field's sightings as a dense table: sort, filter by pest, scout, walk and date, pages, row selection,
// inline edits of pest and count, thumbnails, and export of the filtered rows as CSV or GeoJSON.
import { stopsSummary } from '@shared/units/stops-summary.ts';
import { useEffect, useMemo, useState } from 'react';
import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type RowSelectionState,
  type SortingState,
} from '@tanstack/react-table';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { TableGrid } from '../../../components/table-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { useUpdateSighting } from '../../../lib/api/update-sighting.ts';
import { fieldSightingsQueryKey } from '../../../lib/api/get-sightings.ts';
import { useDates } from '../../../lib/dates.ts';
import { positionSourceText } from '../utils/position-source-text.ts';
import { downloadText, sightingsCsv, sightingsGeoJson } from '../utils/sightings-export.ts';
import { CountEditor, PestEditor } from './sighting-edit-cells.tsx';
import { SightingsTableFilters, type TableFilters } from './sightings-table-filters.tsx';

const column = createColumnHelper<SightingView>();
const PAGE_SIZES = [25, 50, 100, 250];

function Thumbnail({ sighting }: { sighting: SightingView }) {
  const [failed, setFailed] = useState(false);
  if (!sighting.photoId || sighting.thumbnailStatus !== 'ready' || failed) {
    return (
      <span className="flex h-9 w-9 items-center justify-center rounded bg-straw-100 text-[10px] text-soil-700 ring-1 ring-soil-300/60">
        {sighting.isEmptyStop ? 'stop' : sighting.thumbnailStatus === 'pending' ? '…' : '—'}
      </span>
    );
  }
  return (
    <a href={`/api/photos/${sighting.photoId}/original`} target="_blank" rel="noreferrer" aria-label={`Open the photo of ${sighting.pestName}`}>
      <img
        src={`/api/photos/${sighting.photoId}/thumbnail`}
        alt=""
        loading="lazy"
        className="h-9 w-9 rounded bg-straw-100 object-cover ring-1 ring-soil-300/60"
        onError={() => setFailed(true)}
      />
    </a>
  );
}

export function SightingsTable({
  fieldId,
  fieldName,
  crop,
  sightings,
  pests,
  filters,
  onFiltersChange,
  selectedId,
  onShowOnMap,
}: {
  fieldId: string;
  fieldName: string;
  /** The field's crop: its pests lead the pest editor's list. */
  crop?: string;
  sightings: SightingView[];
  pests: Pest[];
  filters: TableFilters;
  onFiltersChange: (filters: TableFilters) => void;
  selectedId: string | null;
  onShowOnMap: (id: string) => void;
}) {
  const update = useUpdateSighting(fieldSightingsQueryKey(fieldId));
  const [sorting, setSorting] = useState<SortingState>([{ id: 'walkedOn', desc: true }]);
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});

  const dates = useDates();
  const columns = useMemo(
    () => [
      column.display({
        id: 'select',
        header: ({ table }) => (
          <input
            type="checkbox"
            aria-label="Select every sighting on this page"
            className="h-4 w-4 rounded border-soil-300 text-field-700"
            checked={table.getIsAllPageRowsSelected()}
            onChange={table.getToggleAllPageRowsSelectedHandler()}
          />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            aria-label={`Select sighting ${row.index + 1}`}
            className="h-4 w-4 rounded border-soil-300 text-field-700"
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      }),
      column.display({ id: 'photo', header: 'Photo', cell: ({ row }) => <Thumbnail sighting={row.original} /> }),
      column.accessor('walkedOn', {
        header: 'Walk',
        filterFn: (row, _id, range: { from?: string; to?: string }) =>
          (!range.from || row.original.walkedOn >= range.from) && (!range.to || row.original.walkedOn <= range.to),
        cell: (info) => <span className="whitespace-nowrap">{dates.calendarDate(info.getValue())}</span>,
      }),
      column.accessor((s) => s.observedAt ?? '', {
        id: 'observedAt',
        header: 'Time',
        cell: (info) => <span className="whitespace-nowrap">{info.getValue() ? dates.dateTime(info.getValue()) : '—'}</span>,
      }),
      column.accessor('pestName', {
        header: 'Pest',
        filterFn: (row, _id, pestId: string) => row.original.pestId === pestId,
        cell: ({ row }) => <PestEditor sighting={row.original} walkDay={dates.calendarDate(row.original.walkedOn)} pests={pests} crop={crop} update={update} />,
      }),
      column.accessor((s) => (s.isEmptyStop ? 0 : (s.count ?? -1)), {
        id: 'count',
        header: 'Count',
        cell: ({ row }) => <CountEditor sighting={row.original} walkDay={dates.calendarDate(row.original.walkedOn)} update={update} />,
      }),
      column.accessor('scoutName', { header: 'Scout', filterFn: (row, _id, scoutId: string) => row.original.scoutId === scoutId }),
      column.accessor('walkId', {
        id: 'walkId',
        header: () => null,
        cell: () => null,
        enableSorting: false,
        filterFn: (row, _id, walkId: string) => row.original.walkId === walkId,
      }),
      column.accessor('positionSource', {
        header: 'Position',
        cell: ({ row }) => (
          <span className="whitespace-nowrap text-xs text-soil-700">
            {positionSourceText(row.original.positionSource)}
            {row.original.accuracyM !== null && ` ±${Math.round(row.original.accuracyM)} m`}
          </span>
        ),
      }),
      column.display({
        id: 'map',
        header: () => <span className="sr-only">Map</span>,
        cell: ({ row }) =>
          row.original.position ? (
            <button
              type="button"
              className="rounded px-1.5 py-0.5 text-xs font-medium text-field-700 hover:bg-field-50 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
              onClick={() => onShowOnMap(row.original.id)}
            >
              Show on map
            </button>
          ) : null,
      }),
    ],
    [pests, crop, update, onShowOnMap, dates],
  );

  const columnFilters = useMemo<ColumnFiltersState>(() => {
    const active: ColumnFiltersState = [];
    if (filters.pestId) active.push({ id: 'pestName', value: filters.pestId });
    if (filters.scoutId) active.push({ id: 'scoutName', value: filters.scoutId });
    if (filters.walkId) active.push({ id: 'walkId', value: filters.walkId });
    if (filters.from || filters.to) active.push({ id: 'walkedOn', value: { from: filters.from, to: filters.to } });
    return active;
  }, [filters]);

  const table = useReactTable({
    data: sightings,
    columns,
    state: { sorting, columnFilters, rowSelection, columnVisibility: { walkId: false } },
    onSortingChange: setSorting,
    onRowSelectionChange: setRowSelection,
    getRowId: (s) => s.id,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize: 25 } },
    autoResetPageIndex: true,
  });

  // Jump to the page holding a sighting picked on the map.
  useEffect(() => {
    if (!selectedId) return;
    const index = table.getSortedRowModel().rows.findIndex((r) => r.id === selectedId);
    if (index >= 0) table.setPageIndex(Math.floor(index / table.getState().pagination.pageSize));
  }, [selectedId, table]);

  const filtered = table.getFilteredRowModel().rows.map((r) => r.original);
  const selected = filtered.filter((s) => rowSelection[s.id]);
  const exported = selected.length > 0 ? selected : filtered;
  const exportName = `${fieldName.replace(/[^\w-]+/g, '-').toLowerCase()}-sightings`;
  const { pageIndex, pageSize } = table.getState().pagination;

  return (
    <div className="space-y-3">
      <SightingsTableFilters sightings={sightings} pests={pests} filters={filters} onChange={onFiltersChange} />
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <p className="text-soil-700" aria-live="polite">
          <span data-filtered-count={filtered.length} className="font-semibold text-soil-900">
            {filtered.length}
          </span>{' '}
          of {stopsSummary(sightings.filter((s) => !s.isEmptyStop).length, sightings.filter((s) => s.isEmptyStop).length)} match
          {selected.length > 0 && <> · {selected.length} selected</>}
        </p>
        <div className="flex flex-wrap gap-2">
          <Button
            size="sm"
            variant="secondary"
            disabled={exported.length === 0}
            onClick={() => downloadText(`${exportName}.csv`, sightingsCsv(exported), 'text/csv;charset=utf-8')}
          >
            Export CSV{selected.length > 0 ? ` (${selected.length} selected)` : ''}
          </Button>
          <Button
            size="sm"
            variant="secondary"
            disabled={exported.length === 0}
            onClick={() => downloadText(`${exportName}.geojson`, JSON.stringify(sightingsGeoJson(exported)), 'application/geo+json')}
          >
            Export GeoJSON{selected.length > 0 ? ` (${selected.length} selected)` : ''}
          </Button>
          {selected.length > 0 && (
            <Button size="sm" variant="quiet" onClick={() => setRowSelection({})}>
              Clear selection
            </Button>
          )}
        </div>
      </div>
      {update.isError && <FormMessage>{errorMessage(update.error)}</FormMessage>}
      <TableGrid
        caption={`Sightings in ${fieldName}`}
        table={table}
        rowClassName={(s) => (s.id === selectedId ? 'bg-straw-100' : s.isEmptyStop ? 'text-soil-600' : '')}
      />
      <nav aria-label="Table pages" className="flex flex-wrap items-center gap-3 text-sm">
        <Button size="sm" variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          Previous
        </Button>
        <span className="tabular-nums text-soil-700">
          Page {table.getPageCount() === 0 ? 0 : pageIndex + 1} of {table.getPageCount()}
        </span>
        <Button size="sm" variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Next
        </Button>
        <label className="ml-auto inline-flex items-center gap-2 text-soil-700">
          Rows per page
          <select
            className="rounded border-0 py-1 pl-2 pr-7 text-sm ring-1 ring-inset ring-soil-300"
            value={pageSize}
            onChange={(e) => table.setPageSize(Number(e.target.value))}
          >
            {PAGE_SIZES.map((size) => (
              <option key={size}>{size}</option>
            ))}
          </select>
        </label>
      </nav>
    </div>
  );
}
