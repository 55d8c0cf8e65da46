// Each compared check's map (lazy-loaded with Leaflet): the boundary, the sightings it took in and its proposed zones.
import { GeoJSON } from 'react-leaflet';
import type { CheckSummary } from '@shared/schemas/checks.ts';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { MapFrame } from '../../../components/map-frame.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useCheck } from '../../../lib/api/get-check.ts';
import { useCheckSightingIds } from '../../../lib/api/get-check-parts.ts';
import { useSightings } from '../../../lib/api/get-sightings.ts';
import palette from '../../../../tailwind.config.ts';
import { windowText } from '../check-comparison.ts';
import { useDates } from '../../../lib/dates.ts';
import { SightingDots } from './map/sighting-dots.tsx';

const { patch } = palette.theme.extend.colors;
const ignoreSelection = () => undefined;

export function ComparisonMaps({ field, earlier, later }: { field: Field; earlier: CheckSummary; later: CheckSummary }) {
  // One read of the field's placed sightings serves both maps; each keeps the ones its check took in.
  const sightings = useSightings({ fieldId: field.id, status: 'placed' });
  if (sightings.isPending) return <LoadingState label="Loading sightings…" />;
  if (sightings.isError) return <ErrorState error={sightings.error} onRetry={() => sightings.refetch()} />;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <CheckMap field={field} summary={earlier} side="Earlier" sightings={sightings.data} />
      <CheckMap field={field} summary={later} side="Later" sightings={sightings.data} />
    </div>
  );
}

function CheckMap({ field, summary, side, sightings }: { field: Field; summary: CheckSummary; side: string; sightings: SightingView[] }) {
  const dates = useDates();
  const check = useCheck(summary.id);
  const sightingIds = useCheckSightingIds(summary.id);
  const taken = new Set(sightingIds.data ?? []);
  const own = sightings.filter((s) => taken.has(s.id));
  const zones = check.data?.result?.zones;
  return (
    <figure className="space-y-1" data-compare-map={summary.id}>
      <figcaption className="text-xs font-medium text-soil-700">
        {side}: {summary.pestName} · {windowText(summary, dates)} ·{' '}
        {zones ? `${zones.features.length} proposed zone${zones.features.length === 1 ? '' : 's'}` : '…'}
      </figcaption>
      {check.isError ? (
        <ErrorState error={check.error} onRetry={() => check.refetch()} />
      ) : (
        <MapFrame boundaries={[{ id: field.id, geometry: field.boundary, label: field.name }]} label={`${side} check: map of ${field.name}`} className="h-72">
          {zones && zones.features.length > 0 && (
            <GeoJSON
              key={`${summary.id}-zones`}
              data={zones}
              style={{ color: patch[700], weight: 2.5, dashArray: '6 4', fillColor: patch[400], fillOpacity: 0.18 }}
            />
          )}
          <SightingDots sightings={own} selectedId={null} onSelect={ignoreSelection} />
        </MapFrame>
      )}
    </figure>
  );
}
