// A sighting's photo thumbnail; a placeholder until the background job has made it (or if it could not).
import { useState } from 'react';
import type { SightingView } from '@shared/schemas/sightings.ts';

type Props = Pick<SightingView, 'photoId' | 'thumbnailStatus' | 'isEmptyStop' | 'pestName'> & { size?: 'sm' | 'lg' };

export function SightingThumbnail({ photoId, thumbnailStatus, isEmptyStop, pestName, size = 'sm' }: Props) {
  const [failed, setFailed] = useState(false);
  const box = size === 'lg' ? 'h-40 w-40' : 'h-16 w-16';
  if (photoId && thumbnailStatus === 'ready' && !failed) {
    return (
      <img
        src={`/api/photos/${photoId}/thumbnail`}
        alt={`Photo of ${pestName}`}
        className={`${box} shrink-0 rounded-md bg-straw-100 object-cover ring-1 ring-soil-300`}
        loading="lazy"
        onError={() => setFailed(true)}
      />
    );
  }
  const text = isEmptyStop ? 'Stop' : thumbnailStatus === 'pending' ? 'Preparing…' : 'No preview';
  return (
    <div
      className={`${box} flex shrink-0 items-center justify-center rounded-md bg-straw-100 px-1 text-center text-xs font-medium text-soil-700 ring-1 ring-soil-300`}
      data-thumbnail={thumbnailStatus ?? 'none'}
    >
      {text}
    </div>
  );
}
