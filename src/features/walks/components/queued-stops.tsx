// The empty stops of this walk still on the phone: waiting for signal, on their way, or refused with the server's reason.
import { Button } from '../../../components/button.tsx';
import { useSignedInUser } from '../../../lib/auth.ts';
import type { QueuedStop } from '../outbox/outbox-store.ts';
import { removeQueued } from '../outbox/outbox-store.ts';
import { drainOutbox } from '../outbox/outbox-sender.ts';
import { useDates } from '../../../lib/dates.ts';

const stateText: Record<QueuedStop['state'], string> = {
  waiting: 'Waiting on this phone to be sent',
  sending: 'Sending…',
  sent: 'Sent',
  refused: 'Not accepted',
};

export function QueuedStops({ stops }: { stops: QueuedStop[] }) {
  const dates = useDates();
  const ownerId = useSignedInUser().id;
  const shown = stops.filter((s) => s.state !== 'sent');
  if (!shown.length) return null;
  return (
    <ul className="space-y-2" aria-label="Stops kept on this phone">
      {shown.map((stop) => (
        <li
          key={stop.clientId}
          data-stop-state={stop.state}
          className={`rounded-lg border-l-8 p-3 ring-1 ring-soil-300/60 ${stop.state === 'refused' ? 'border-patch-600 bg-patch-50 text-patch-700' : 'border-straw-500 bg-straw-100 text-soil-900'}`}
        >
          <p className="text-sm text-soil-700">Nothing found, {dates.time(stop.observedAt)}</p>
          <p className="text-base font-semibold">{stateText[stop.state]}</p>
          {stop.state === 'refused' && <p className="mt-1 text-sm font-medium">{stop.refusal}</p>}
          {stop.state === 'waiting' && stop.lastError && <p className="mt-1 text-sm">{stop.lastError}</p>}
          <div className="mt-2 flex flex-wrap gap-2">
            {stop.state === 'waiting' && (
              <Button size="lg" variant="secondary" onClick={() => void drainOutbox(ownerId)}>
                Send now
              </Button>
            )}
            {stop.state === 'refused' && (
              <Button size="lg" variant="quiet" onClick={() => void removeQueued(stop.clientId)}>
                Remove this stop
              </Button>
            )}
          </div>
        </li>
      ))}
    </ul>
  );
}
