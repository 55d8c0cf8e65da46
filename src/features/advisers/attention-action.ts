// The words on an attention line's button, from why the line is there and where it leads.
import type { AttentionField } from '@shared/schemas/checks.ts';

/** What the line's button says, from where it leads. */
export function attentionAction(item: Pick<AttentionField, 'reason' | 'link'>): string {
  if (item.reason === 'not-yet-checked') return 'Run a check';
  if (item.reason === 'rescout-due' || item.reason === 'too-few-stops') return 'Open the field';
  return item.link.includes('/zones') ? 'Open the zones' : 'Open the check';
}
