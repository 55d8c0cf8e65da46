// The adviser's check options as typed: what reaches the engine, and the messages shown beside the inputs.
import { describe, expect, it } from 'vitest';
import { defaultDraft, optionsFromDraft, type CheckOptionsDraft } from '../../../src/features/checks/check-options-draft.ts';

const draft = (change: Partial<CheckOptionsDraft>): CheckOptionsDraft => ({ ...defaultDraft, ...change });

describe('check options typed by the adviser', () => {
  it('start at 999 simulations and α = 0.05, the common choice for a Monte Carlo test at the 5 % level (common practice)', () => {
    const built = optionsFromDraft(defaultDraft);
    expect(built).toMatchObject({ ok: true, options: { simulations: 999, alpha: 0.05, kernel: 'quartic', areaBasis: 'boundary' } });
  });

  it('leave a blank input to the engine’s own rule rather than sending 0', () => {
    const built = optionsFromDraft(draft({ cellSizeM: '  ', bandwidthM: '' }));
    expect(built.ok && built.options.cellSizeM).toBeUndefined();
    expect(built.ok && built.options.bandwidthM).toBeUndefined();
  });

  it('read metres as typed', () => {
    const built = optionsFromDraft(draft({ cellSizeM: '25', bandwidthM: '40.5' }));
    expect(built).toMatchObject({ ok: true, options: { cellSizeM: 25, bandwidthM: 40.5 } });
  });

  it('turn a custom area typed in hectares into m² (1 ha = 10 000 m²)', () => {
    const built = optionsFromDraft(draft({ areaBasis: 'custom', customAreaHa: '12.5' }));
    expect(built).toMatchObject({ ok: true, options: { areaBasis: 'custom', customAreaM2: 125_000 } });
  });

  it('ignore a custom area left over when another basis is chosen', () => {
    const built = optionsFromDraft(draft({ areaBasis: 'hull', customAreaHa: '12.5' }));
    expect(built.ok && built.options.customAreaM2).toBeUndefined();
  });

  it('ask for the area beside the hectare input when the custom basis has none', () => {
    const built = optionsFromDraft(draft({ areaBasis: 'custom', customAreaHa: '' }));
    expect(built.ok).toBe(false);
    expect(!built.ok && built.errors.customAreaHa).toMatch(/ha/);
    expect(!built.ok && built.errors.customAreaHa).not.toMatch(/m²/);
  });

  it('refuse a significance level of 0, where no test could ever reject', () => {
    const built = optionsFromDraft(draft({ alpha: '0' }));
    expect(built.ok).toBe(false);
    expect(!built.ok && built.errors.alpha).toBeTruthy();
  });

  it('refuse a fractional number of simulations', () => {
    const built = optionsFromDraft(draft({ simulations: '99.5' }));
    expect(built.ok).toBe(false);
    expect(!built.ok && built.errors.simulations).toMatch(/whole number/);
  });

  it('refuse text that is not a number', () => {
    const built = optionsFromDraft(draft({ cellSizeM: 'ten' }));
    expect(built.ok).toBe(false);
    expect(!built.ok && built.errors.cellSizeM).toBeTruthy();
  });
});
