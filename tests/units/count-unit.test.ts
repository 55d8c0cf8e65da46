import { describe, expect, it } from 'vitest';
import { countWithUnit, unitFor } from '../../shared/units/count-unit.ts';

// Expected forms follow the Unicode CLDR plural rule for English ("one: i = 1 and v = 0"; every other number,
// decimals included, takes "other") and ordinary English singulars.
describe('a count with its unit', () => {
  it('reads "1 aphid per plant" and "2 aphids per plant"', () => {
    expect(countWithUnit(1, 'aphids per plant')).toBe('1 aphid per plant');
    expect(countWithUnit(2, 'aphids per plant')).toBe('2 aphids per plant');
  });

  it('keeps the plural for zero and for decimals, as CLDR’s English rule has it', () => {
    expect(countWithUnit(0, 'beetles per plant')).toBe('0 beetles per plant');
    expect(countWithUnit(0.75, 'beetles per plant')).toBe('0.75 beetles per plant');
    expect(countWithUnit(1, 'beetles per plant', (v) => v.toFixed(2))).toBe('1.00 beetles per plant');
  });

  it('knows the irregular singulars of the trade', () => {
    expect(countWithUnit(1, 'larvae per seedling')).toBe('1 larva per seedling');
    expect(countWithUnit(1, 'leaves with lesions per plant')).toBe('1 leaf with lesions per plant');
    expect(unitFor(1, 'grasshoppers per square yard')).toBe('grasshopper per square yard');
    expect(unitFor(1, 'plants per square metre')).toBe('plant per square metre');
  });
});
