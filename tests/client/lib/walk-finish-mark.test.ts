// The finish mark in lists of walks. Expected clock times come from ECMA-402 Intl.DateTimeFormat itself (short time
// style in the organisation's locale and zone), not from our own date writers.
import { describe, expect, it } from 'vitest';
import { datesIn } from '../../../shared/dates/format-dates.ts';
import { walkFinishMark } from '../../../src/lib/walk-finish-mark.ts';

const london = { locale: 'en-GB', timeZone: 'Europe/London' };
const shortTime = (iso: string, format: { locale: string; timeZone: string }) =>
  new Intl.DateTimeFormat(format.locale, { timeStyle: 'short', ...format }).format(new Date(iso));

describe('walk finish mark', () => {
  it('gives a finished walk its finishing time in the organisation’s zone, whatever its day', () => {
    const finishedAt = '2026-07-09T14:05:00.000Z';
    expect(walkFinishMark({ walkedOn: '2026-07-09', finishedAt }, '2026-12-03', datesIn(london))).toBe(`Finished at ${shortTime(finishedAt, london)}`);
    const chicago = { locale: 'en-US', timeZone: 'America/Chicago' };
    expect(walkFinishMark({ walkedOn: '2026-12-03', finishedAt }, '2026-12-03', datesIn(chicago))).toBe(`Finished at ${shortTime(finishedAt, chicago)}`);
  });

  it('says today’s open walk is in progress, and says nothing of an older open one', () => {
    expect(walkFinishMark({ walkedOn: '2026-12-03', finishedAt: null }, '2026-12-03', datesIn(london))).toBe('In progress');
    expect(walkFinishMark({ walkedOn: '2026-12-02', finishedAt: null }, '2026-12-03', datesIn(london))).toBeNull();
  });
});
