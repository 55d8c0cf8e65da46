// Beside a threshold the admin has not yet checked against its source, so it never reads as if it were sourced.
import { NEEDS_CONFIRMING, unconfirmedThresholdSentence } from '@shared/thresholds/threshold-confirmation.ts';

export function NeedsConfirmingMark({ sentence = unconfirmedThresholdSentence, className = '' }: { sentence?: string; className?: string }) {
  return (
    <p className={`text-xs text-soil-800 ${className}`} data-needs-confirming>
      <span className="mr-1 inline-block whitespace-nowrap rounded bg-straw-200 px-1.5 py-0.5 font-semibold text-soil-900 ring-1 ring-inset ring-straw-500">
        {NEEDS_CONFIRMING}
      </span>
      {sentence}
    </p>
  );
}
