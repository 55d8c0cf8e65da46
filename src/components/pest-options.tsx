// The <option>s of a pest choice, the field's crop's pests first under their own heading and the rest after.
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { pestsForCrop } from '@shared/pests/pests-for-crop.ts';

export function PestOptions({ pests, crop, label = (p) => p.name }: { pests: Pest[]; crop?: string; label?: (pest: Pest) => string }) {
  const { ofCrop, others } = pestsForCrop(pests, crop);
  const options = (list: Pest[]) =>
    list.map((p) => (
      <option key={p.id} value={p.id}>
        {label(p)}
      </option>
    ));
  // With no pest of this crop in the library, a heading would only say so; the plain list reads better.
  if (ofCrop.length === 0) return <>{options(others)}</>;
  return (
    <>
      <optgroup label={`Pests of ${crop!.trim()}`}>{options(ofCrop)}</optgroup>
      {others.length > 0 && <optgroup label="Other pests">{options(others)}</optgroup>}
    </>
  );
}
