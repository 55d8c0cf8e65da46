// Global rank envelope (Myllymäki et al. 2017). At a single radius the extreme rank length ordering is the
// two-sided Monte Carlo rank test: p = 2·k/(s + 1) for an observation k-th most extreme of s + 1 values
// (Besag & Diggle 1977), which these checks use as the outside reference.
import { describe, expect, it } from 'vitest';
import { globalRankEnvelope } from '../../shared/analysis/global-envelope.ts';

describe('global rank envelope', () => {
  const simulations = 99;
  const simulated = Float64Array.from({ length: simulations }, (_, i) => i + 1);

  it('gives the two-sided rank test p at one radius for the largest value', () => {
    const envelope = globalRankEnvelope([10], [1000], simulated, simulations, 0.05);
    expect(envelope.pValue).toBeCloseTo(2 / 100, 12);
    expect(envelope.side).toBe('high');
    expect(envelope.aboveM).toEqual([10]);
  });

  it('gives p = 1 for the median value and keeps it inside the envelope', () => {
    const envelope = globalRankEnvelope([10], [50], simulated, simulations, 0.05);
    expect(envelope.pValue).toBe(1);
    expect(envelope.aboveM).toEqual([]);
    expect(envelope.belowM).toEqual([]);
  });

  it('leaves out radii where every curve is the same and names them', () => {
    const two = new Float64Array(simulations * 2);
    for (let s = 0; s < simulations; s++) two.set([0, s + 1], s * 2);
    const envelope = globalRankEnvelope([5, 10], [0, 1000], two, simulations, 0.05);
    expect(envelope.undefinedM).toEqual([5]);
    expect(envelope.pValue).toBeCloseTo(2 / 100, 12);
  });
});
