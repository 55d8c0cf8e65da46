// Unit symbols against the SI Brochure (BIPM, 9th edition 2019; section and table numbers from memory): §5.2 — unit
// symbols are printed in upright type, are case-sensitive (lower case unless the unit is named after a person) and never
// change with the surrounding text; §5.4.3 — a space separates the number from the symbol; Table 7 (SI prefixes) — "M"
// is the prefix mega and "k" kilo; Table 8 (non-SI units accepted for use with the SI) — the hectare is "ha". The acre
// has no SI symbol: "ac" is common practice in agriculture (not a standard).
import { describe, expect, it } from 'vitest';
import { UNIT_SYMBOLS, withUnit } from '../../shared/units/unit-symbols.ts';
import { formatArea } from '../../shared/units/area.ts';
import { formatRouteLength } from '../../shared/units/route-length.ts';

describe('unit symbols', () => {
  it('writes the metre as lower-case "m" (SI Brochure Table 2), never "M", which is the prefix mega (Table 7)', () => {
    expect(UNIT_SYMBOLS.metre).toBe('m');
  });

  it('writes the kilometre with the lower-case prefix kilo, "km" (SI Brochure Table 7)', () => {
    expect(UNIT_SYMBOLS.kilometre).toBe('km');
  });

  it('writes the square metre as "m" with a superscript two (SI Brochure §5.4.1, powers of units)', () => {
    expect(UNIT_SYMBOLS.squareMetre).toBe('m\u00b2');
  });

  it('writes the hectare "ha" (SI Brochure Table 8)', () => {
    expect(UNIT_SYMBOLS.hectare).toBe('ha');
  });

  it('writes the acre "ac" (common practice in agriculture; no SI symbol exists)', () => {
    expect(UNIT_SYMBOLS.acre).toBe('ac');
  });

  it('leaves a space between the number and the symbol and keeps the symbol’s case (SI Brochure §5.2, §5.4.3)', () => {
    expect(withUnit('25', 'metre')).toBe('25 m');
    expect(withUnit('1.20', 'hectare')).toBe('1.20 ha');
  });

  it('writes an area in hectares and acres with their symbols: 10 000 m² is 1 ha (Table 8) and 2.47 ac (1 ac = 4046.8564224 m², NIST Handbook 44 App. C)', () => {
    expect(formatArea(10_000)).toBe('1.00 ha (2.47 ac)');
  });

  it('writes a walk’s length in lower-case metres, and in kilometres from 1000 m (1 km = 1000 m, SI Brochure Table 7)', () => {
    expect(formatRouteLength(640)).toBe('640 m');
    expect(formatRouteLength(1250)).toBe('1.25 km');
  });
});
