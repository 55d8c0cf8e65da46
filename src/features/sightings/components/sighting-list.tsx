// A walk's sightings as a list a scout can read in the sun: thumbnail, pest, count, where the position came from.
import { Link } from 'react-router';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { SightingThumbnail } from './sighting-thumbnail.tsx';
import { positionSourceLabel } from './position-source.ts';

const number = new Intl.NumberFormat('en', { maximumFractionDigits: 2 });

export function SightingList({ sightings, pinHref }: { sightings: SightingView[]; pinHref: (sighting: SightingView) => string }) {
  return (
    <ul className="divide-y divide-straw-200" aria-label="Sightings on this walk">
      {sightings.map((s) => (
        <li key={s.id} className="flex items-center gap-3 py-3" data-sighting-status={s.status} data-position-source={s.positionSource}>
          <SightingThumbnail photoId={s.photoId} thumbnailStatus={s.thumbnailStatus} isEmptyStop={s.isEmptyStop} pestName={s.pestName} />
          <div className="min-w-0 flex-1">
            <p className="font-semibold text-soil-900">{s.isEmptyStop ? `Nothing found · ${s.pestName}` : s.pestName}</p>
            <p className="text-sm text-soil-700">
              {s.isEmptyStop ? 'Count 0' : s.count === null ? 'No count' : `Count ${number.format(s.count)}`}
              {' · '}
              <span className={s.status === 'needs-pin' ? 'font-semibold text-patch-700' : ''}>{positionSourceLabel(s)}</span>
              {s.accuracyM !== null && s.status === 'placed' && ` (±${number.format(Math.round(s.accuracyM))} m)`}
            </p>
            {s.timeFlag && s.timeFlag !== 'missing' && (
              <p className="text-xs text-soil-600">The photo’s time looks {s.timeFlag === 'future' ? 'in the future' : 'years old'}; the walk date is used.</p>
            )}
          </div>
          {s.status === 'needs-pin' && (
            <Link to={pinHref(s)} className="inline-flex min-h-12 items-center rounded-md bg-patch-700 px-4 font-semibold text-white">
              Pin it
            </Link>
          )}
        </li>
      ))}
    </ul>
  );
}
