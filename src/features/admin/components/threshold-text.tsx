import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { unitFor } from '@shared/units/count-unit.ts';
import { NeedsConfirmingMark } from '../../../components/needs-confirming-mark.tsx';

const basisLabels: Record<Pest['thresholdBasis'], string> = { mean: 'mean count per stop', incidence: 'share of stops infested' };
export const thresholdBasisLabel = (basis: Pest['thresholdBasis']) => basisLabels[basis];

/** A threshold is never shown without where it comes from. */
export function ThresholdText({ pest }: { pest: Pest }) {
  return (
    <div className="space-y-0.5">
      <p>
        <span className="font-semibold">{pest.actionThreshold.toLocaleString('en-GB')}</span>{' '}
        {unitFor(pest.actionThreshold, pest.countUnit, pest.actionThreshold.toLocaleString('en-GB'))}{' '}
        <span className="text-xs text-soil-600">({basisLabels[pest.thresholdBasis]})</span>
      </p>
      {pest.thresholdNote && <p className="text-xs text-soil-700">{pest.thresholdNote}</p>}
      <p className="text-xs text-soil-600">
        <span className="font-medium">Source:</span> {pest.thresholdSource}
      </p>
      {!pest.thresholdConfirmed && <NeedsConfirmingMark />}
    </div>
  );
}
