// Formatting of the engine's figures for screen: digits and units only, never a new computation.
import { withUnit } from '@shared/units/unit-symbols.ts';
import { toAcres, toHectares } from '@shared/units/area.ts';

const blank = '—';

export const isFigure = (value: number | null | undefined): value is number => typeof value === 'number' && Number.isFinite(value);

export function fixed(value: number | null | undefined, digits = 2): string {
  return isFigure(value) ? value.toFixed(digits) : blank;
}

/** p-values the way a handbook prints them: three decimals, or "< 0.001". */
export function pText(value: number | null | undefined): string {
  if (!isFigure(value)) return blank;
  return value < 0.001 ? '< 0.001' : value.toFixed(3);
}

export function metres(value: number | null | undefined, digits = 1): string {
  return isFigure(value) ? withUnit(value.toFixed(digits), 'metre') : blank;
}

export function hectaresAndAcres(m2: number | null | undefined): string {
  return isFigure(m2) ? `${withUnit(toHectares(m2).toFixed(2), 'hectare')} · ${withUnit(toAcres(m2).toFixed(2), 'acre')}` : blank;
}

export function percent(share: number | null | undefined, digits = 0): string {
  return isFigure(share) ? `${(share * 100).toFixed(digits)} %` : blank;
}

export const areaBasisLabels = {
  boundary: 'Field boundary',
  bbox: 'Bounding rectangle of the sightings',
  hull: 'Convex hull of the sightings',
  custom: 'Custom area',
} as const;
