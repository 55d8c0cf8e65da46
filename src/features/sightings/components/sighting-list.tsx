// A walk's sightings as a list a scout can read in the sun: thumbnail, pest, count, where the position came from;
// with `correction`, each row opens a form to change its pest or count; with `removal`, the rows it allows can be removed.
import { useState } from 'react';
import { Link } from 'react-router';
import type { QueryKey } from '@tanstack/react-query';
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { Button } from '../../../components/button.tsx';
import { ConfirmDialog } from '../../../components/confirm-dialog.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useRemoveSighting } from '../../../lib/api/remove-sighting.ts';
import { SIGHTING_RECOVERABLE_DAYS } from '@shared/schemas/sightings.ts';
import { SightingThumbnail } from './sighting-thumbnail.tsx';
import { SightingCorrectionForm } from './sighting-correction-form.tsx';
import { positionSourceLabel } from './position-source.ts';

const number = new Intl.NumberFormat('en', { maximumFractionDigits: 2 });

export function SightingList({
  sightings,
  pinHref,
  correction,
  removal,
}: {
  sightings: SightingView[];
  pinHref: (sighting: SightingView) => string;
  /** The pests to choose from and the query that lists these sightings (refetched after a correction). */
  correction?: { pests: Pest[]; shownUnder: QueryKey; crop?: string };
  /** Which rows may be removed (a scout's own), and the query that lists these sightings. */
  removal?: { mayRemove: (sighting: SightingView) => boolean; shownUnder: QueryKey };
}) {
  const [correcting, setCorrecting] = useState<string | null>(null);
  const [removing, setRemoving] = useState<SightingView | null>(null);
  const remove = useRemoveSighting(removal?.shownUnder ?? []);
  const what = (s: SightingView) => (s.isEmptyStop ? 'the empty stop' : 'the sighting');
  return (
    <>
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
              {removal?.mayRemove(s) && correcting !== s.id && (
                <Button variant="secondary" size="lg" onClick={() => setRemoving(s)} aria-label={`Remove ${what(s)}: ${s.pestName}`}>
                  Remove
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
      {removal && (
        <ConfirmDialog
          open={removing !== null}
          title={removing?.isEmptyStop ? 'Remove this empty stop?' : 'Remove this sighting?'}
          confirmLabel="Remove"
          busy={remove.isPending}
          onCancel={() => {
            remove.reset();
            setRemoving(null);
          }}
          onConfirm={() => removing && remove.mutate(removing.id, { onSuccess: () => setRemoving(null) })}
        >
          <p>
            {removing?.pestName}: it leaves the map, the counts and future checks. You can restore it from “Removed” on this walk for{' '}
            {SIGHTING_RECOVERABLE_DAYS} days.
          </p>
          {remove.isError && <FormMessage>{errorMessage(remove.error)}</FormMessage>}
        </ConfirmDialog>
      )}
    </>
  );
}
