import { withUnit } from './unit-symbols.ts';

// International acre (NIST Handbook 44, Appendix C): 1 ac = 4046.8564224 m².
export const SQUARE_METRES_PER_ACRE = 4046.8564224;
export const SQUARE_METRES_PER_HECTARE = 10_000;

export const toHectares = (m2: number) => m2 / SQUARE_METRES_PER_HECTARE;
export const toAcres = (m2: number) => m2 / SQUARE_METRES_PER_ACRE;

export function formatArea(m2: number) {
  return `${withUnit(toHectares(m2).toFixed(2), 'hectare')} (${withUnit(toAcres(m2).toFixed(2), 'acre')})`;
}
