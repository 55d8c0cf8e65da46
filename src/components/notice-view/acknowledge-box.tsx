// The grower's acknowledgement: one press records it; afterwards the page says when. The caller supplies the
// request (the e-mailed link's, or the signed-in grower's).
import type { Dates } from '@shared/dates/format-dates.ts';
import { Button } from '../button.tsx';
import { FormMessage } from '../form-field.tsx';

export interface AcknowledgeControl {
  onAcknowledge: () => void;
  busy: boolean;
  /** The server's sentence when the acknowledgement was refused. */
  error?: string;
}

export function AcknowledgeBox({ acknowledgedAt, control, dates }: { acknowledgedAt: string | null; control: AcknowledgeControl; dates: Dates }) {
  if (acknowledgedAt) {
    return (
      <p role="status" className="rounded-lg bg-field-50 px-4 py-3 text-field-900 ring-1 ring-inset ring-field-200">
        <span aria-hidden="true">✓ </span>Acknowledged on {dates.dateTime(acknowledgedAt)}. Your adviser can see that you have read this notice.
      </p>
    );
  }
  return (
    <div className="rounded-lg bg-straw-50 px-4 py-3 ring-1 ring-inset ring-straw-300 print:hidden">
      <p className="text-soil-800">When you have read this notice, let your adviser know. Acknowledging does not commit you to any treatment.</p>
      <Button className="mt-3" size="lg" onClick={control.onAcknowledge} busy={control.busy}>
        Acknowledge
      </Button>
      {control.error && (
        <div className="mt-2">
          <FormMessage>{control.error}</FormMessage>
        </div>
      )}
    </div>
  );
}
