// Across the top of every page: the phone is offline, and how many photos and stops wait on it to be sent.
import { unsentCount } from '../upload-queue.ts';
import { useOnline, useOutbox } from '../outbox/use-outbox.ts';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function OutboxBanner() {
  const online = useOnline();
  const items = useOutbox();
  const waiting = unsentCount(items);
  const refused = items.filter((i) => i.state === 'refused').length;
  if (online && !waiting && !refused) return null;
  const parts = [
    !online ? 'This phone is offline.' : null,
    waiting ? `${plural(waiting, 'item waits', 'items wait')} on this phone: ${online ? 'sending now' : 'sent by itself when there is signal'}.` : null,
    !waiting && !online ? 'Everything you record is kept on this phone until there is signal.' : null,
    refused ? `${plural(refused, 'item was', 'items were')} not accepted: see the walk for the reason.` : null,
  ].filter(Boolean);
  return (
    <div
      role="status"
      aria-live="polite"
      data-testid="outbox-banner"
      className={`px-4 py-2 text-center text-sm font-medium ${online ? 'bg-straw-100 text-soil-900' : 'bg-soil-800 text-white'}`}
    >
      {parts.join(' ')}
    </div>
  );
}
