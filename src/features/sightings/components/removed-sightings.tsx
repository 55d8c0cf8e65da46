// Sightings removed from a walk that can still come back: one "Restore" each, with the server's reason when it cannot.
import { useState } from 'react';
import type { QueryKey } from '@tanstack/react-query';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useRestoreSighting } from '../../../lib/api/remove-sighting.ts';
import { SightingThumbnail } from './sighting-thumbnail.tsx';

export function RemovedSightings({ removed, shownUnder }: { removed: SightingView[]; shownUnder: QueryKey }) {
  const restore = useRestoreSighting(shownUnder);
  const [failed, setFailed] = useState<{ id: string; message: string } | null>(null);
  return (
    <ul className="divide-y divide-straw-200" aria-label="Removed from this walk">
      {removed.map((s) => (
        <li key={s.id} className="py-3">
          <div className="flex items-center gap-3">
            <SightingThumbnail photoId={null} thumbnailStatus={null} isEmptyStop={s.isEmptyStop} pestName={s.pestName} />
            <p className="min-w-0 flex-1 font-semibold text-soil-700 line-through decoration-soil-400">
              {s.isEmptyStop ? `Nothing found · ${s.pestName}` : `${s.pestName}${s.count === null ? '' : ` · Count ${s.count}`}`}
            </p>
            <Button
              variant="secondary"
              size="lg"
              busy={restore.isPending && restore.variables === s.id}
              aria-label={`Restore ${s.isEmptyStop ? 'the empty stop' : 'the sighting'}: ${s.pestName}`}
              onClick={() => {
                setFailed(null);
                restore.mutate(s.id, { onError: (error) => setFailed({ id: s.id, message: errorMessage(error) }) });
              }}
            >
              Restore
            </Button>
          </div>
          {failed?.id === s.id && <FormMessage>{failed.message}</FormMessage>}
        </li>
      ))}
    </ul>
  );
}
