// One way to name a set of stops everywhere: "84 stops: 60 with pests, 24 empty". An empty stop is a place the
// scout looked and found nothing; it is a stop, never a sighting of a pest.

const plural = new Intl.PluralRules('en-GB');
export const stopsWord = (n: number) => `${n} ${plural.select(n) === 'one' ? 'stop' : 'stops'}`;

export function stopsSummary(withPest: number, empty: number, pestName?: string): string {
  const found = pestName ? `${withPest} with ${pestName}` : `${withPest} with pests`;
  return `${stopsWord(withPest + empty)}: ${found}, ${empty} empty`;
}
