// The grower's acknowledgement: one press records it; afterwards the page says when.
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useAcknowledgeNotice } from '../api/acknowledge-notice.ts';

export function AcknowledgeBox({ token, acknowledgedAt }: { token: string; acknowledgedAt: string | null }) {
  const acknowledge = useAcknowledgeNotice(token);
  if (acknowledgedAt) {
    return (
      <p role="status" className="rounded-lg bg-field-50 px-4 py-3 text-field-900 ring-1 ring-inset ring-field-200">
        <span aria-hidden="true">✓ </span>Acknowledged on {new Date(acknowledgedAt).toLocaleString(undefined, { dateStyle: 'long', timeStyle: 'short' })}. Your adviser can see that you have read this notice.
      </p>
    );
  }
  return (
    <div className="rounded-lg bg-straw-50 px-4 py-3 ring-1 ring-inset ring-straw-300 print:hidden">
      <p className="text-soil-800">When you have read this notice, let your adviser know. Acknowledging does not commit you to any treatment.</p>
      <Button className="mt-3" size="lg" onClick={() => acknowledge.mutate()} busy={acknowledge.isPending}>
        Acknowledge
      </Button>
      {acknowledge.isError && <div className="mt-2"><FormMessage>{errorMessage(acknowledge.error)}</FormMessage></div>}
    </div>
  );
}
