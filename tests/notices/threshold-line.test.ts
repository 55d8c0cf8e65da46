// The notice's threshold line in mail and print: an unchecked threshold says so in the line itself, a confirmed
// one and one from a notice sent before confirmation was kept do not.
import { describe, expect, it } from 'vitest';
import { thresholdSourceText } from '../../shared/notices/notice-words.ts';
import { unconfirmedThresholdNoticeSentence } from '../../shared/thresholds/threshold-confirmation.ts';

const threshold = { value: 2, unit: 'larvae per seedling', source: 'An extension bulletin' };

describe("the notice's threshold line", () => {
  it('marks a threshold not yet checked against its source', () => {
    expect(thresholdSourceText({ ...threshold, confirmed: false })).toContain(`Needs confirming: ${unconfirmedThresholdNoticeSentence}`);
  });

  it('leaves the mark off a confirmed threshold and off an older notice that did not keep it', () => {
    expect(thresholdSourceText({ ...threshold, confirmed: true })).not.toContain('Needs confirming');
    expect(thresholdSourceText(threshold)).not.toContain('Needs confirming');
  });
});
