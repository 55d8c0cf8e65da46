// The zones being edited, with area (ha and ac), share of the field, the sightings inside each and its stops against the threshold.
import { createColumnHelper } from '@tanstack/react-table';
import { toAcres, toHectares } from '@shared/units/area.ts';
import { TableFrame } from '../../../components/table-frame.tsx';
import { Button } from '../../../components/button.tsx';
import type { WorkingZone, ZoneFigures, ZoneStanding } from '../working-zones.ts';

export interface ZoneRow {
  zone: WorkingZone;
  figures: ZoneFigures;
  standing: ZoneStanding;
}

export interface ZoneThreshold {
  actionThreshold: number;
  thresholdBasis: 'mean' | 'incidence';
  countUnit: string;
}

const two = new Intl.NumberFormat('en', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const percent = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 1 });
const originWords = { proposed: 'As proposed', edited: 'Edited', drawn: 'Drawn by hand', stored: 'As stored' } as const;
const standingWords = { 'at-or-above': 'at or above', below: 'below', 'no-stops': '' } as const;

function StandingCell({ standing, threshold }: { standing: ZoneStanding; threshold: ZoneThreshold | null }) {
  if (standing.value === null) return <span className="text-soil-600">No counted stops</span>;
  const incidence = threshold?.thresholdBasis === 'incidence';
  const figure = incidence ? percent.format(standing.value) : two.format(standing.value);
  return (
    <span className="tabular-nums" data-standing={standing.standing}>
      {figure}
      {threshold && (
        <span className={standing.standing === 'at-or-above' ? 'font-medium text-patch-700' : 'text-soil-600'}>
          {' '}
          — {standingWords[standing.standing]} {incidence ? percent.format(threshold.actionThreshold) : threshold.actionThreshold}
        </span>
      )}
      <span className="block text-xs text-soil-600">
        {standing.stops} stop{standing.stops === 1 ? '' : 's'}
      </span>
    </span>
  );
}
const column = createColumnHelper<ZoneRow>();

export function ZoneTable({ rows, threshold, onDelete }: { rows: ZoneRow[]; threshold: ZoneThreshold | null; onDelete: (key: string) => void }) {
  const columns = [
    column.accessor((r) => r.zone.label, { id: 'label', header: 'Zone' }),
    column.accessor((r) => r.figures.areaM2, {
      id: 'ha',
      header: 'Area (ha)',
      cell: (c) => <span className="tabular-nums">{two.format(toHectares(c.getValue()))}</span>,
    }),
    column.accessor((r) => r.figures.areaM2, {
      id: 'ac',
      header: 'Area (ac)',
      cell: (c) => <span className="tabular-nums">{two.format(toAcres(c.getValue()))}</span>,
    }),
    column.accessor((r) => r.figures.shareOfField, {
      id: 'share',
      header: 'Share of field',
      cell: (c) => <span className="tabular-nums">{percent.format(c.getValue())}</span>,
    }),
    column.accessor((r) => r.figures.sightingsInside, {
      id: 'sightings',
      header: 'Sightings inside',
      cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
    }),
    column.accessor((r) => r.standing.value, {
      id: 'standing',
      header:
        threshold?.thresholdBasis === 'incidence' ? 'Stops infested vs threshold' : `Mean count vs threshold${threshold ? ` (${threshold.countUnit})` : ''}`,
      cell: (c) => <StandingCell standing={c.row.original.standing} threshold={threshold} />,
    }),
    column.accessor((r) => r.zone.origin, {
      id: 'origin',
      header: 'Shape',
      cell: (c) => (
        <span className={c.row.original.figures.fromEngine ? '' : 'text-patch-700'}>
          {originWords[c.getValue()]}
          {!c.row.original.figures.fromEngine && <span className="sr-only"> (figures measured in the browser)</span>}
        </span>
      ),
    }),
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (c) => (
        <Button variant="quiet" size="sm" onClick={() => onDelete(c.row.original.zone.key)} aria-label={`Delete ${c.row.original.zone.label}`}>
          Delete
        </Button>
      ),
    }),
  ];
  return <TableFrame caption="Treatment zones being edited" columns={columns} rows={rows} rowId={(r) => r.zone.key} />;
}
