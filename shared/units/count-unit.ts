// A number with its pest's count unit, grammatical in English: "1 aphid per plant", "2 aphids per plant",
// "0.75 beetles per plant". The library stores the plural ("aphids per plant"); the count's leading noun is
// made singular when Intl.PluralRules says the number takes the singular form.

const plural = new Intl.PluralRules('en-GB');

// Nouns of the trade whose singular is not the plural less its final "s".
const irregularSingulars: Record<string, string> = { larvae: 'larva', leaves: 'leaf', pupae: 'pupa', nymphs: 'nymph', mice: 'mouse', lice: 'louse' };

export function singularNoun(word: string): string {
  const lower = word.toLowerCase();
  if (irregularSingulars[lower]) return irregularSingulars[lower];
  if (/[^aeiou]ies$/.test(lower)) return word.slice(0, -3) + 'y';
  if (/(ss|us|is)$/.test(lower)) return word;
  if (lower.endsWith('s')) return word.slice(0, -1);
  return word;
}

/**
 * The count unit as it reads after `written` ("aphids per plant" → "aphid per plant" after "1"). English takes the
 * singular only for exactly 1 written without decimals (CLDR plural rule "one: i = 1 and v = 0"), so "1.00 aphids".
 */
export function unitFor(value: number, unit: string, written = String(value)): string {
  if (plural.select(value) !== 'one' || /[.,]/.test(written)) return unit;
  const [first, ...rest] = unit.split(' ');
  return [singularNoun(first), ...rest].join(' ');
}

/** `value` formatted by `format` (default: as written) followed by its unit. */
export function countWithUnit(value: number, unit: string, format: (value: number) => string = String): string {
  const written = format(value);
  return `${written} ${unitFor(value, unit, written)}`;
}
