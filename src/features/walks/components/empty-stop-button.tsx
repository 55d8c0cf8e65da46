// "Nothing found here": a zero-count stop for the chosen pest at the phone's position, so checks know where the scout looked.
import { useState } from 'react';
import { Button } from '../../../components/button.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useCurrentPosition } from '../../../lib/use-current-position.ts';
import { useRecordStop } from '../api/record-stop.ts';

const metres = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

export function EmptyStopButton({ walkId, pestId, pestName }: { walkId: string; pestId: string; pestName?: string }) {
  const { status, locate } = useCurrentPosition();
  const recordStop = useRecordStop(walkId);
  const [saved, setSaved] = useState<number | null>(null);

  async function recordHere() {
    setSaved(null);
    recordStop.reset();
    const position = await locate();
    if (!position) return;
    await recordStop.mutateAsync({ pestId, ...position }).then(
      () => setSaved(position.accuracyM),
      () => {},
    );
  }

  const locating = status.kind === 'locating';
  return (
    <div className="space-y-2">
      <Button
        size="lg"
        variant="secondary"
        className="w-full min-h-16 border-2 border-field-700 text-lg font-semibold"
        onClick={recordHere}
        busy={locating || recordStop.isPending}
        disabled={!pestId}
      >
        Nothing found here
      </Button>
      <p className="text-sm text-soil-700" role="status" aria-live="polite">
        {!pestId && 'Choose the pest you are looking for first.'}
        {locating && 'Finding the phone’s position…'}
        {status.kind === 'failed' && <span className="font-medium text-patch-700">{status.message}</span>}
        {recordStop.isError && <span className="font-medium text-patch-700">{errorMessage(recordStop.error)}</span>}
        {saved !== null && !recordStop.isPending && `Stop recorded: no ${pestName ?? 'pest'} here, position within ±${metres.format(saved)} m.`}
      </p>
    </div>
  );
}
