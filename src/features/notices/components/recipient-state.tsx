// One recipient's state as a badge: delivery first, then the grower's reading.
import type { RecipientState } from '@shared/schemas/notices.ts';

const looks: Record<RecipientState, { words: string; className: string }> = {
  queued: { words: 'queued', className: 'bg-straw-100 text-soil-700' },
  sending: { words: 'sending', className: 'bg-straw-100 text-soil-700' },
  sent: { words: 'sent', className: 'bg-field-50 text-field-800' },
  failed: { words: 'failed', className: 'bg-patch-100 text-patch-700' },
  opened: { words: 'opened', className: 'bg-field-100 text-field-800' },
  acknowledged: { words: 'acknowledged', className: 'bg-field-700 text-white' },
};

export function RecipientStateBadge({ state }: { state: RecipientState }) {
  const look = looks[state];
  return <span className={`inline-block rounded-full px-2 py-0.5 text-xs font-semibold ${look.className}`}>{look.words}</span>;
}
