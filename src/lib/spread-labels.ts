// The spread verdict's label on screen: the review, its list of past checks and the field page show the same words.
import type { SpreadVerdict } from '@shared/analysis/spread.ts';

export const spreadLabels: Record<SpreadVerdict, string> = {
  clustered: 'Clustered',
  random: 'Random',
  regular: 'Spread out',
  'too-few': 'Too few sightings',
  everywhere: 'Everywhere',
  'cant-tell': "Can't tell",
};
