import { toAcres, toHectares } from '@shared/units/area.ts';

const number = new Intl.NumberFormat('en', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

/** An area shown both ways: hectares first, acres beside. */
export function AreaText({ m2, className = '' }: { m2: number; className?: string }) {
  return (
    <span className={className} data-area-m2={m2}>
      <span data-unit="ha">{number.format(toHectares(m2))} ha</span>
      <span className="text-soil-600"> · </span>
      <span data-unit="ac">{number.format(toAcres(m2))} ac</span>
    </span>
  );
}
