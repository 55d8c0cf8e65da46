// A walk's sightings as a list a scout can read in the sun: thumbnail, pest, count, where the position came from;
// with `correction`, each row opens a form to change its pest or count.
import { useState } from 'react';
import { Link } from 'react-router';
import type { QueryKey } from '@tanstack/react-query';
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { Button } from '../../../components/button.tsx';
import { SightingThumbnail } from './sighting-thumbnail.tsx';
import { SightingCorrectionForm } from './sighting-correction-form.tsx';
import { positionSourceLabel } from './position-source.ts';

const number = new Intl.NumberFormat('en', { maximumFractionDigits: 2 });

export function SightingList({
  sightings,
  pinHref,
  correction,
}: {
  sightings: SightingView[];
  pinHref: (sighting: SightingView) => string;
  /** The pests to choose from and the query that lists these sightings (refetched after a correction). */
  correction?: { pests: Pest[]; shownUnder: QueryKey; crop?: string };
}) {
  const [correcting, setCorrecting] = useState<string | null>(null);
  return (
    <ul className="divide-y divide-straw-200" aria-label="Sightings on this walk">
      {sightings.map((s) => (
        <li key={s.id} className="py-3" data-sighting-status={s.status} data-position-source={s.positionSource}>
          <div className="flex items-center gap-3">
            <SightingThumbnail photoId={s.photoId} thumbnailStatus={s.thumbnailStatus} isEmptyStop={s.isEmptyStop} pestName={s.pestName} />
            <div className="min-w-0 flex-1">
              <p className="font-semibold text-soil-900">{s.isEmptyStop ? `Nothing found · ${s.pestName}` : s.pestName}</p>
              <p className="text-sm text-soil-700">
                <span data-testid="sighting-count">{s.isEmptyStop ? 'Count 0' : s.count === null ? 'No count' : `Count ${number.format(s.count)}`}</span>
                {' · '}
                <span className={s.status === 'needs-pin' ? 'font-semibold text-patch-700' : ''}>{positionSourceLabel(s)}</span>
                {s.accuracyM !== null && s.status === 'placed' && ` (±${number.format(Math.round(s.accuracyM))} m)`}
              </p>
              {s.timeFlag && s.timeFlag !== 'missing' && (
                <p className="text-xs text-soil-600">
                  The photo’s time looks {s.timeFlag === 'future' ? 'in the future' : 'years old'}; the walk date is used.
                </p>
              )}
            </div>
            {s.status === 'needs-pin' && (
              <Link to={pinHref(s)} className="inline-flex min-h-12 items-center rounded-md bg-patch-700 px-4 font-semibold text-white">
                Pin it
              </Link>
            )}
            {correction && correcting !== s.id && (
              <Button
                variant="secondary"
                size="lg"
                onClick={() => setCorrecting(s.id)}
                aria-label={`Correct ${s.isEmptyStop ? 'the empty stop' : 'the sighting'}: ${s.pestName}`}
              >
                Correct
              </Button>
            )}
          </div>
          {correction && correcting === s.id && (
            <SightingCorrectionForm
              sighting={s}
              pests={correction.pests}
              crop={correction.crop}
              shownUnder={correction.shownUnder}
              onDone={() => setCorrecting(null)}
            />
          )}
        </li>
      ))}
    </ul>
  );
}
