// The pest list that follows a field's crop: the crop's pests first, the rest after, crop names matched
// without regard to case or surrounding spaces.
import { describe, expect, it } from 'vitest';
import { pestsForCrop } from '../../shared/pests/pests-for-crop.ts';

const pests = [
  { name: 'Beetle', crops: ['Corn'] },
  { name: 'Aphid', crops: ['soybean'] },
  { name: 'Weevil', crops: [] },
  { name: 'Hopper', crops: ['corn', 'soybean'] },
];
const names = (list: { name: string }[]) => list.map((p) => p.name);

describe('pests for a crop', () => {
  it("puts the crop's pests first, whatever the case, and keeps the library's order within each group", () => {
    const { ofCrop, others } = pestsForCrop(pests, ' CORN ');
    expect(names(ofCrop)).toEqual(['Beetle', 'Hopper']);
    expect(names(others)).toEqual(['Aphid', 'Weevil']);
  });

  it('lists every pest as other when no crop is known or none matches', () => {
    expect(pestsForCrop(pests, undefined)).toEqual({ ofCrop: [], others: pests });
    expect(pestsForCrop(pests, 'barley')).toEqual({ ofCrop: [], others: pests });
  });
});
