// The walk on the field: found sightings sized by count, empty stops as rings, what still waits on the phone,
// and where the scout stands now.
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import { MapFrame } from '../../../components/map-frame.tsx';
import { YouAreHere } from '../../../components/you-are-here.tsx';
import { SightingMarkers } from '../../sightings/components/sighting-markers.tsx';
import { WalkRouteLine } from '../../sightings/components/walk-route-line.tsx';
import { QueuedMarkers, type QueuedPlace } from './queued-markers.tsx';

export function WalkMap({ field, sightings, queued = [] }: { field: Field; sightings: SightingView[]; queued?: QueuedPlace[] }) {
  const placed = sightings.filter((s) => s.position);
  return (
    <div className="space-y-2">
      <MapFrame
        boundaries={[{ id: field.id, geometry: field.boundary, label: field.name }]}
        label={`Map of ${field.name} with this walk’s sightings`}
        className="h-80"
      >
        <WalkRouteLine sightings={placed} />
        <SightingMarkers sightings={placed} />
        <QueuedMarkers places={queued} />
        <YouAreHere />
      </MapFrame>
      <p className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm text-soil-700">
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3.5 w-3.5 rounded-full bg-patch-500 ring-2 ring-patch-700" /> found (larger = higher count)
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3.5 w-3.5 rounded-full ring-[3px] ring-soil-800" /> nothing found
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3.5 w-3.5 rounded-full border-[3px] border-dashed border-straw-500 bg-straw-200" /> waiting on this
          phone
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3.5 w-3.5 rounded-full bg-field-800 ring-2 ring-field-300" /> you are here
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block w-5 border-t-2 border-dashed border-soil-700" /> route, in the order recorded
        </span>
        <span>{placed.length} on the map</span>
        {queued.length > 0 && <span>{queued.length} waiting</span>}
      </p>
    </div>
  );
}
