// What an adviser needs about one sighting: its photo, pest, count, scout, time and where its position came from.
import type { SightingView } from '@shared/schemas/sightings.ts';
import { useState } from 'react';
import { positionSourceText } from '../utils/position-source-text.ts';
import { useDates } from '../../../lib/dates.ts';
import { countText, PhotoViewer, timeText } from './photo-viewer.tsx';

export function SightingDetails({ sighting }: { sighting: SightingView }) {
  const dates = useDates();
  const [viewing, setViewing] = useState(false);
  return (
    <div className="w-56 space-y-2 font-sans text-sm text-soil-800" data-sighting-details={sighting.id}>
      {sighting.photoId ? (
        <button type="button" className="block w-full" title="View the photo" onClick={() => setViewing(true)}>
          <img
            src={`/api/photos/${sighting.photoId}/thumbnail`}
            alt={`Photo of ${sighting.pestName}`}
            className="h-36 w-full rounded bg-straw-100 object-cover ring-1 ring-soil-300"
          />
        </button>
      ) : (
        <p className="rounded bg-straw-100 px-2 py-3 text-center text-xs text-soil-600">{sighting.isEmptyStop ? 'Empty stop — no photo' : 'No photo'}</p>
      )}
      <dl className="grid grid-cols-[5.5rem_1fr] gap-x-2 gap-y-0.5">
        <dt className="text-soil-600">Pest</dt>
        <dd className="font-medium">{sighting.pestName}</dd>
        <dt className="text-soil-600">Count</dt>
        <dd>{countText(sighting)}</dd>
        <dt className="text-soil-600">Scout</dt>
        <dd>{sighting.scoutName}</dd>
        <dt className="text-soil-600">Time</dt>
        <dd>{timeText(sighting, dates)}</dd>
        <dt className="text-soil-600">Position</dt>
        <dd>
          {positionSourceText(sighting.positionSource)}
          {sighting.accuracyM !== null && ` ±${Math.round(sighting.accuracyM)} m`}
        </dd>
      </dl>
      {sighting.photoId && (
        <button type="button" onClick={() => setViewing(true)} className="font-medium text-field-700 underline">
          View photo
        </button>
      )}
      {viewing && sighting.photoId && <PhotoViewer sighting={sighting} onClose={() => setViewing(false)} />}
    </div>
  );
}
