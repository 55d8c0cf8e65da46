import { describe, expect, it } from 'vitest';
import { stopsSummary } from '../../shared/units/stops-summary.ts';

// The wording the product's vocabulary fixes: every row is a stop; some have the pest, the rest are empty.
describe('naming stops and sightings', () => {
  it('counts every row as a stop and splits them into found and empty', () => {
    expect(stopsSummary(60, 24)).toBe('84 stops: 60 with pests, 24 empty');
    expect(stopsSummary(3, 2, 'Soybean aphid')).toBe('5 stops: 3 with Soybean aphid, 2 empty');
  });

  it('uses the singular for one stop, as CLDR’s English rule has it', () => {
    expect(stopsSummary(1, 0)).toBe('1 stop: 1 with pests, 0 empty');
  });
});
