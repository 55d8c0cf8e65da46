// "Nothing found here": a zero-count stop for the chosen pest at the phone's position, so checks know where the scout looked.
// The stop goes into the outbox on the phone first, so it is kept with or without signal.
import { useState } from 'react';
import { Button } from '../../../components/button.tsx';
import { useCurrentPosition } from '../../../lib/use-current-position.ts';
import { useSignedInUser } from '../../../lib/auth.ts';
import { newClientId } from '../client-id.ts';
import { queueAndSend } from '../outbox/outbox-sender.ts';
import { askForBackgroundSync } from '../outbox/use-outbox.ts';

const metres = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

export function EmptyStopButton({ walkId, pestId, pestName }: { walkId: string; pestId: string; pestName?: string }) {
  const { status, locate } = useCurrentPosition();
  const ownerId = useSignedInUser().id;
  const [saved, setSaved] = useState<{ accuracyM: number; online: boolean } | null>(null);
  const [storeError, setStoreError] = useState<string | null>(null);

  async function recordHere() {
    setSaved(null);
    setStoreError(null);
    const position = await locate();
    if (!position) return;
    try {
      await queueAndSend({
        kind: 'stop',
        clientId: newClientId(),
        ownerId,
        state: 'waiting',
        attempts: 0,
        createdAt: Date.now(),
        walkId,
        pestId,
        ...position,
        observedAt: new Date().toISOString(),
      });
      setSaved({ accuracyM: position.accuracyM, online: navigator.onLine });
      void askForBackgroundSync();
    } catch {
      setStoreError('This phone could not keep the stop (its storage is full or blocked in private browsing). Free some space and tap again.');
    }
  }

  const locating = status.kind === 'locating';
  return (
    <div className="space-y-2">
      <Button
        size="lg"
        variant="secondary"
        className="w-full min-h-16 border-2 border-field-700 text-lg font-semibold"
        onClick={recordHere}
        busy={locating}
        disabled={!pestId}
      >
        Nothing found here
      </Button>
      <p className="text-sm text-soil-700" role="status" aria-live="polite">
        {!pestId && 'Choose the pest you are looking for first.'}
        {locating && 'Finding the phone’s position (up to 15 seconds)…'}
        {status.kind === 'failed' && <span className="font-medium text-patch-700">No stop recorded: {status.message}</span>}
        {storeError && <span className="font-medium text-patch-700">{storeError}</span>}
        {saved &&
          !locating &&
          `Stop recorded: no ${pestName ?? 'pest'} here, position within ±${metres.format(saved.accuracyM)} m${saved.online ? '.' : '; kept on this phone until there is signal.'}`}
      </p>
    </div>
  );
}
