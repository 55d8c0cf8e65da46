// The review table's walk filter. Expected labels follow the Unicode CLDR long date patterns as ECMA-402
// Intl.DateTimeFormat applies them: en-GB "d MMMM y" ("9 July 2026"), en-US "MMMM d, y" ("July 1, 2026").
import { describe, expect, it } from 'vitest';
import { datesIn } from '../../../shared/dates/format-dates.ts';
import { walkChoices } from '../../../src/features/checks/walk-choices.ts';

const walk = (walkId: string, walkedOn: string, scoutName: string) => ({ walkId, walkedOn, scoutName });

describe('walk filter choices', () => {
  it('names each walk once by its day in the en-GB long form and its scout, newest day first', () => {
    const sightings = [walk('w9', '2026-07-09', 'Ann'), walk('w10', '2026-07-10', 'Ben'), walk('w9', '2026-07-09', 'Ann'), walk('w10b', '2026-07-10', 'Abe')];
    expect(walkChoices(sightings, datesIn({ locale: 'en-GB', timeZone: 'Europe/London' }))).toEqual([
      ['w10b', '10 July 2026 · Abe'],
      ['w10', '10 July 2026 · Ben'],
      ['w9', '9 July 2026 · Ann'],
    ]);
  });

  it('writes a walk day as that calendar day in zones behind and ahead of UTC, never the day before or after', () => {
    const sightings = [walk('w1', '2026-07-01', 'Ann')];
    // Read as an instant, "2026-07-01" is midnight UTC: still 30 June in Chicago (UTC−5 in July), 1 July in Kiritimati (UTC+14).
    expect(walkChoices(sightings, datesIn({ locale: 'en-US', timeZone: 'America/Chicago' }))).toEqual([['w1', 'July 1, 2026 · Ann']]);
    expect(walkChoices(sightings, datesIn({ locale: 'en-GB', timeZone: 'Pacific/Kiritimati' }))).toEqual([['w1', '1 July 2026 · Ann']]);
  });

  it('adds the finish mark a walk has, and names a walk without one by its day and scout alone', () => {
    const sightings = [walk('w9', '2026-07-09', 'Ann'), walk('w10', '2026-07-10', 'Ben')];
    const marks = new Map([['w10', 'Finished at 10:42']]);
    expect(walkChoices(sightings, datesIn({ locale: 'en-GB', timeZone: 'Europe/London' }), (id) => marks.get(id) ?? null)).toEqual([
      ['w10', '10 July 2026 · Ben · Finished at 10:42'],
      ['w9', '9 July 2026 · Ann'],
    ]);
  });
});
