// Formatting of the engine's figures for screen: digits and units only, never a new computation.

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
  return isFigure(value) ? `${value.toFixed(digits)} m` : blank;
}

const M2_PER_HA = 10_000;
const M2_PER_AC = 4046.8564224;

export function hectaresAndAcres(m2: number | null | undefined): string {
  return isFigure(m2) ? `${(m2 / M2_PER_HA).toFixed(2)} ha · ${(m2 / M2_PER_AC).toFixed(2)} ac` : blank;
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
