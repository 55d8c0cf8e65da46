// A pest list that follows the field's crop: the pests of that crop first, every other pest after, so a scout
// still finds a pest that turns up where nobody expected it.

const cropKey = (crop: string) => crop.trim().toLocaleLowerCase('en');

/** Whether the pest belongs to this crop, whatever the case or spacing either side wrote it with. */
export const belongsToCrop = (pest: { crops: string[] }, crop: string) => pest.crops.some((c) => cropKey(c) === cropKey(crop));

/** The pests of `crop` and the others, each group in the order given. Without a crop every pest is "other". */
export function pestsForCrop<P extends { crops: string[] }>(pests: P[], crop: string | undefined): { ofCrop: P[]; others: P[] } {
  if (!crop || !cropKey(crop)) return { ofCrop: [], others: pests };
  return { ofCrop: pests.filter((p) => belongsToCrop(p, crop)), others: pests.filter((p) => !belongsToCrop(p, crop)) };
}
