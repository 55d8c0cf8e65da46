// The choices on the dates-and-times screen: a short list of locales and every IANA time zone the browser knows, by region.

/** Locales an advisory business is likely to use; the organisation's own is added when it is not among them. */
export const COMMON_LOCALES = [
  'en-GB',
  'en-US',
  'en-CA',
  'en-AU',
  'en-NZ',
  'en-IE',
  'en-ZA',
  'fr-FR',
  'fr-CA',
  'de-DE',
  'nl-NL',
  'es-ES',
  'es-MX',
  'pt-BR',
  'it-IT',
];

/** The locale tags to offer, the current one first when the short list lacks it. */
export function localeChoices(current: string): string[] {
  return COMMON_LOCALES.includes(current) ? COMMON_LOCALES : [current, ...COMMON_LOCALES];
}

/** A locale's name in its own language with its tag, e.g. "English (United States) · en-US"; the bare tag if unnamed. */
export function localeLabel(tag: string): string {
  try {
    const name = new Intl.DisplayNames([tag], { type: 'language', languageDisplay: 'standard' }).of(tag);
    return name && name !== tag ? `${name} · ${tag}` : tag;
  } catch {
    return tag;
  }
}

export interface ZoneGroup {
  region: string;
  zones: string[];
}

/** Time zones grouped by the region before the first slash ("America/Chicago" under America), UTC and the current one kept. */
export function timeZoneGroups(current: string, known: readonly string[] = Intl.supportedValuesOf('timeZone')): ZoneGroup[] {
  // Browsers leave UTC out of the list; an organisation may still keep its dates in it.
  const zones = [...new Set([...known, 'UTC', current])];
  const groups = new Map<string, string[]>();
  for (const zone of zones) {
    const slash = zone.indexOf('/');
    const region = slash > 0 ? zone.slice(0, slash) : 'Other';
    groups.set(region, [...(groups.get(region) ?? []), zone]);
  }
  return [...groups.entries()]
    .map(([region, list]) => ({ region, zones: list.sort() }))
    .sort((a, b) => (a.region === 'Other' ? 1 : b.region === 'Other' ? -1 : a.region.localeCompare(b.region)));
}

/** A zone's name for people: underscores read as spaces ("America/Argentina/Buenos_Aires" → "Argentina/Buenos Aires"). */
export function zoneLabel(zone: string): string {
  const slash = zone.indexOf('/');
  return (slash > 0 ? zone.slice(slash + 1) : zone).replaceAll('_', ' ');
}
