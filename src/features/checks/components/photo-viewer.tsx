// A sighting's photo at full size in a dialog, with what it shows: pest, count, time and position.
import { useEffect, useRef } from 'react';
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { Dates } from '@shared/dates/format-dates.ts';
import { useDates } from '../../../lib/dates.ts';
import { positionSourceText } from '../utils/position-source-text.ts';

export function countText(sighting: SightingView): string {
  if (sighting.isEmptyStop) return '0 (nothing found)';
  return sighting.count === null ? 'present, not counted' : String(sighting.count);
}

export function timeText(sighting: SightingView, dates: Dates): string {
  return sighting.observedAt
    ? dates.dateTime(sighting.observedAt)
    : `recorded ${dates.dateTime(sighting.createdAt)} (walk of ${dates.calendarDate(sighting.walkedOn)})`;
}

export function positionText(sighting: SightingView): string {
  const where = sighting.position ? `${sighting.position.lat.toFixed(6)}, ${sighting.position.lon.toFixed(6)}` : 'not placed';
  const accuracy = sighting.accuracyM !== null ? ` ±${Math.round(sighting.accuracyM)} m` : '';
  return `${where} (${positionSourceText(sighting.positionSource)}${accuracy})`;
}

export function PhotoViewer({ sighting, onClose }: { sighting: SightingView; onClose: () => void }) {
  const dates = useDates();
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = dialog.current;
    if (d && !d.open) d.showModal();
  }, []);
  return (
    <dialog
      ref={dialog}
      onClose={onClose}
      aria-label={`Photo of ${sighting.pestName}`}
      className="max-h-[95vh] w-[min(56rem,95vw)] rounded-lg p-0 font-sans text-sm text-soil-800 backdrop:bg-soil-900/70"
    >
      <figure className="space-y-2 p-3">
        <img
          src={`/api/photos/${sighting.photoId}/original`}
          alt={`Photo of ${sighting.pestName}`}
          className="max-h-[70vh] w-full rounded bg-straw-100 object-contain"
        />
        <figcaption>
          <dl className="grid grid-cols-[6rem_1fr] gap-x-2 gap-y-0.5">
            <dt className="text-soil-600">Pest</dt>
            <dd className="font-medium">{sighting.pestName}</dd>
            <dt className="text-soil-600">Count</dt>
            <dd>{countText(sighting)}</dd>
            <dt className="text-soil-600">Time</dt>
            <dd>{timeText(sighting, dates)}</dd>
            <dt className="text-soil-600">Position</dt>
            <dd>{positionText(sighting)}</dd>
          </dl>
        </figcaption>
      </figure>
      <div className="flex justify-end gap-3 border-t border-straw-200 p-3">
        <a href={`/api/photos/${sighting.photoId}/original`} target="_blank" rel="noreferrer" className="font-medium text-field-700 underline">
          Open the original file
        </a>
        <button type="button" onClick={() => dialog.current?.close()} className="rounded bg-field-700 px-3 py-1.5 font-semibold text-white">
          Close
        </button>
      </div>
    </dialog>
  );
}
