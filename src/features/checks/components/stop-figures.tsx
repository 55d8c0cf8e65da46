// Each stop's Gi* figures, behind a disclosure: they grow with the stops, so they are fetched only when opened.
import { useMemo, useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { Button } from '../../../components/button.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { TableFrame } from '../../../components/table-frame.tsx';
import { useDates } from '../../../lib/dates.ts';
import { useCheckStops } from '../../../lib/api/get-check-parts.ts';
import { fixed, pText } from '../utils/figures.ts';
import { stopReading, stopsInReadingOrder, type StopFigure, type StopReading } from '../utils/stop-readings.ts';

const PAGE = 25;

const readingWords: Record<StopReading, string> = {
  hot: 'Hot: heavy counts around it beyond chance',
  cold: 'Cold: light counts around it beyond chance',
  neither: 'Neither',
};

export function StopFigures({ checkId, sightings, onShowOnMap }: { checkId: string; sightings: SightingView[]; onShowOnMap: (sightingId: string) => void }) {
  const [open, setOpen] = useState(false);
  return (
    <details className="mt-3 text-sm" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="cursor-pointer font-medium text-field-800">Each stop’s figures (Gi*)</summary>
      {open && <StopFiguresTable checkId={checkId} sightings={sightings} onShowOnMap={onShowOnMap} />}
    </details>
  );
}

function StopFiguresTable({ checkId, sightings, onShowOnMap }: { checkId: string; sightings: SightingView[]; onShowOnMap: (sightingId: string) => void }) {
  const stops = useCheckStops(checkId);
  const dates = useDates();
  const [shown, setShown] = useState(PAGE);
  const rows = useMemo(() => (stops.data ? stopsInReadingOrder(stops.data) : []), [stops.data]);
  const byId = useMemo(() => new Map(sightings.map((s) => [s.id, s])), [sightings]);
  const columns = useMemo(() => {
    const column = createColumnHelper<StopFigure>();
    return [
      column.display({
        id: 'stop',
        header: 'Stop',
        cell: ({ row }) => {
          const sighting = byId.get(row.original.id);
          const when = sighting?.observedAt ?? sighting?.createdAt;
          return (
            <span>
              {when ? dates.dateTime(when) : 'Stop outside this window'}
              {row.original.mergedPhotos > 1 && <span className="block text-xs text-soil-600">{row.original.mergedPhotos} photos taken as one stop</span>}
            </span>
          );
        },
      }),
      column.accessor('count', { header: 'Count', enableSorting: false, cell: (c) => <span className="tabular-nums">{c.getValue()}</span> }),
      column.accessor('z', { header: 'Gi* z', enableSorting: false, cell: (c) => <span className="tabular-nums">{fixed(c.getValue())}</span> }),
      column.accessor('pValue', { header: 'p', enableSorting: false, cell: (c) => <span className="tabular-nums">{pText(c.getValue())}</span> }),
      column.accessor('qValue', { header: 'q (many tests)', enableSorting: false, cell: (c) => <span className="tabular-nums">{pText(c.getValue())}</span> }),
      column.display({
        id: 'reading',
        header: 'Reading',
        cell: ({ row }) => <span data-stop-reading={stopReading(row.original)}>{readingWords[stopReading(row.original)]}</span>,
      }),
      column.display({
        id: 'map',
        header: () => <span className="sr-only">Map</span>,
        cell: ({ row }) =>
          byId.get(row.original.id)?.position ? (
            <Button size="sm" variant="quiet" onClick={() => onShowOnMap(row.original.id)}>
              Show on map
            </Button>
          ) : null,
      }),
    ];
  }, [byId, dates, onShowOnMap]);

  if (stops.isPending) return <LoadingState label="Loading each stop’s figures…" />;
  if (stops.isError) return <ErrorState error={stops.error} onRetry={() => stops.refetch()} />;
  const hot = rows.filter((r) => r.hot).length;
  const cold = rows.filter((r) => r.cold).length;
  return (
    <div className="mt-2 space-y-2">
      <p className="text-soil-700" data-stop-tally>
        {rows.length} stops with a count: {hot} hot, {cold} cold. Hot and cold stops come first, the most marked at the top; q allows for testing every stop at
        once (Benjamini–Hochberg).
      </p>
      <TableFrame caption="Each stop's Gi* figures" columns={columns} rows={rows.slice(0, shown)} rowId={(r) => r.id} />
      {shown < rows.length && (
        <Button size="sm" variant="secondary" onClick={() => setShown((n) => n + PAGE)}>
          Show {Math.min(PAGE, rows.length - shown)} more of {rows.length - shown}
        </Button>
      )}
    </div>
  );
}
