// Starting today's walk works without signal: the phone names the walk itself and keeps it until the server has it.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError } from '../../../lib/api-client.ts';
import { useSignedInUser } from '../../../lib/auth.ts';
import { walksQueryKey } from '../../../lib/api/get-walks.ts';
import { newWalkId } from '../client-id.ts';
import { putWalkStartedOffline } from '../outbox/outbox-store.ts';
import { createWalk } from './create-walk.ts';

/** A weak signal that answers nothing should not hold the scout at the gate: past this, the walk starts on the phone. */
const START_PATIENCE_MS = 8_000;

/** No answer came back: no connection, the CSRF token could not be fetched, or the signal gave out. */
const noAnswer = (error: unknown) =>
  error instanceof TypeError || (error instanceof ApiError && error.status === 0) || (error as Error).name === 'TimeoutError';

export interface StartedWalk {
  walkId: string;
  /** True when the walk waits on the phone for signal. */
  keptOnPhone: boolean;
}

export function useStartWalk() {
  const queryClient = useQueryClient();
  const me = useSignedInUser();
  return useMutation({
    mutationFn: async ({ field, walkedOn }: { field: { id: string; name: string }; walkedOn: string }): Promise<StartedWalk> => {
      const id = newWalkId();
      const keepOnPhone = async () => {
        await putWalkStartedOffline({ id, ownerId: me.id, fieldId: field.id, fieldName: field.name, walkedOn, createdAt: Date.now() });
        return { walkId: id, keptOnPhone: true };
      };
      if (navigator.onLine === false) return keepOnPhone();
      try {
        const { walk } = await createWalk({ id, fieldId: field.id, walkedOn }, AbortSignal.timeout(START_PATIENCE_MS));
        return { walkId: walk.id, keptOnPhone: false };
      } catch (error) {
        // Sent again later under the same id, a walk the server did make after all is found, not doubled.
        if (noAnswer(error)) return keepOnPhone();
        throw error;
      }
    },
    onSuccess: (_started, { field }) => queryClient.invalidateQueries({ queryKey: walksQueryKey(field.id) }),
  });
}
