// Needs a pin: the photo beside a map of its field; tap where it was taken (or type the place), then confirm.
import { useState } from 'react';
import type { QueryKey } from '@tanstack/react-query';
import type { Position, SightingView } from '@shared/schemas/sightings.ts';
import { MapFrame, type MapBoundary } from '../../../components/map-frame.tsx';
import { YouAreHere } from '../../../components/you-are-here.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useUpdateSighting } from '../../../lib/api/update-sighting.ts';
import { PinByCoordinates } from './pin-by-coordinates.tsx';
import { PinPicker } from './pin-picker.tsx';
import { SightingMarkers } from './sighting-markers.tsx';
import { SightingThumbnail } from './sighting-thumbnail.tsx';

const degrees = new Intl.NumberFormat('en', { minimumFractionDigits: 6, maximumFractionDigits: 6 });

export function PinSightingPanel({
  sighting,
  boundary,
  neighbours,
  shownUnder,
  onPinned,
}: {
  sighting: SightingView;
  boundary: MapBoundary;
  /** The walk's other placed sightings, as landmarks. */
  neighbours: SightingView[];
  shownUnder: QueryKey;
  onPinned: () => void;
}) {
  const [chosen, setChosen] = useState<Position | null>(sighting.position);
  const update = useUpdateSighting(shownUnder);

  return (
    <div className="space-y-4">
      {sighting.photoId && sighting.thumbnailStatus === 'ready' ? (
        <img
          src={`/api/photos/${sighting.photoId}/thumbnail`}
          alt={`The photo to pin: ${sighting.pestName}`}
          className="max-h-72 w-full rounded-lg bg-straw-100 object-contain ring-1 ring-soil-300"
        />
      ) : (
        <SightingThumbnail photoId={sighting.photoId} thumbnailStatus={sighting.thumbnailStatus} isEmptyStop={false} pestName={sighting.pestName} size="lg" />
      )}
      {sighting.photoId && (
        <a
          href={`/api/photos/${sighting.photoId}/original`}
          target="_blank"
          rel="noreferrer"
          className="inline-block min-h-12 py-3 font-medium text-field-700 underline"
        >
          Open the full photo
        </a>
      )}
      <p className="text-base text-soil-800">Tap the map where this photo was taken, or give the place below the map.</p>
      <MapFrame boundaries={[boundary]} label="Map of the field: tap where the photo was taken" className="h-[26rem] [&_.leaflet-container]:cursor-crosshair">
        <SightingMarkers sightings={neighbours} />
        <YouAreHere />
        <PinPicker chosen={chosen} onChoose={setChosen} />
      </MapFrame>
      <PinByCoordinates chosen={chosen} onChoose={setChosen} />
      <p className="text-sm text-soil-700" aria-live="polite">
        {chosen ? `Chosen: ${degrees.format(chosen.lat)}, ${degrees.format(chosen.lon)}` : 'No place chosen yet.'}
      </p>
      {update.isError && <FormMessage>{errorMessage(update.error)}</FormMessage>}
      <Button
        size="lg"
        className="w-full min-h-14 text-lg"
        disabled={!chosen}
        busy={update.isPending}
        onClick={() => chosen && update.mutate({ sightingId: sighting.id, change: { position: chosen } }, { onSuccess: onPinned })}
      >
        Confirm this place
      </Button>
    </div>
  );
}
