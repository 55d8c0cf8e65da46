// The choices of the dates-and-times screen. Zone names are those of the IANA tz database; Intl.supportedValuesOf is ECMA-402.
import { describe, expect, it } from 'vitest';
import { COMMON_LOCALES, localeChoices, localeLabel, timeZoneGroups, zoneLabel } from '../../../src/features/admin/date-choices.ts';

describe('the dates-and-times choices', () => {
  it('offers the short list of locales, with the organisation’s own first when the list lacks it', () => {
    expect(localeChoices('en-US')).toEqual(COMMON_LOCALES);
    expect(localeChoices('sv-SE')).toEqual(['sv-SE', ...COMMON_LOCALES]);
  });

  it('names a locale in its own language beside its tag (Unicode CLDR display names)', () => {
    expect(localeLabel('en-US')).toBe('English (United States) · en-US');
    expect(localeLabel('de-DE')).toBe('Deutsch (Deutschland) · de-DE');
  });

  it('groups the IANA zones by region and keeps UTC and a current zone missing from the runtime’s list', () => {
    const groups = timeZoneGroups('Antarctica/Troll', ['Europe/London', 'America/Chicago', 'America/Argentina/Buenos_Aires', 'Pacific/Auckland']);
    expect(groups.map((g) => g.region)).toEqual(['America', 'Antarctica', 'Europe', 'Pacific', 'Other']);
    expect(groups[0].zones).toEqual(['America/Argentina/Buenos_Aires', 'America/Chicago']);
    expect(groups.at(-1)!.zones).toEqual(['UTC']);
  });

  it('offers every zone the runtime knows, each once', () => {
    const offered = timeZoneGroups('Europe/London').flatMap((g) => g.zones);
    expect(new Set(offered).size).toBe(offered.length);
    for (const zone of Intl.supportedValuesOf('timeZone')) expect(offered).toContain(zone);
  });

  it('writes a zone for people, without its region and with spaces for underscores', () => {
    expect(zoneLabel('America/Argentina/Buenos_Aires')).toBe('Argentina/Buenos Aires');
    expect(zoneLabel('UTC')).toBe('UTC');
  });
});
