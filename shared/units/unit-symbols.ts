// The symbols of the lengths and areas Patchwise writes. Unit symbols are case-sensitive (a metre is "m", never "M",
// which is the prefix mega), so no style upper-cases text that holds one: table headers are set in their own case.

export const UNIT_SYMBOLS = {
  metre: 'm',
  kilometre: 'km',
  squareMetre: 'm²',
  hectare: 'ha',
  acre: 'ac',
} as const;

export type UnitName = keyof typeof UNIT_SYMBOLS;

/** A value and its unit symbol, separated by a space as the SI writes a quantity ("25 m", "1.20 ha"). */
export const withUnit = (written: string, unit: UnitName) => `${written} ${UNIT_SYMBOLS[unit]}`;
