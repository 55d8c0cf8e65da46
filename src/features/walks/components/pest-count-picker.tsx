// What the batch is about: the pest (from the pest library, with its count unit, the field's crop's pests first) and
// a count for every photo.
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { SelectField, TextField } from '../../../components/form-field.tsx';
import { PestOptions } from '../../../components/pest-options.tsx';

export function PestCountPicker({
  pests,
  crop,
  pestId,
  count,
  onPest,
  onCount,
}: {
  pests: Pest[];
  /** The field's crop, when the photos belong to a known field. */
  crop?: string;
  pestId: string;
  count: string;
  onPest: (pestId: string) => void;
  onCount: (count: string) => void;
}) {
  const pest = pests.find((p) => p.id === pestId);
  return (
    <div className="grid gap-3 sm:grid-cols-[2fr_1fr]">
      <SelectField
        label="Pest"
        value={pestId}
        onChange={(e) => onPest(e.target.value)}
        className="[&_select]:min-h-12 [&_select]:text-base"
        hint={pest ? `Counted as ${pest.countUnit}` : 'What are these photos of?'}
      >
        <option value="">Choose the pest…</option>
        <PestOptions pests={pests} crop={crop} label={(p) => `${p.name} (${p.countUnit})`} />
      </SelectField>
      <TextField
        label="Count for each photo"
        hint={pest ? pest.countUnit : 'Leave blank if you did not count'}
        inputMode="decimal"
        type="number"
        min={0}
        step="any"
        value={count}
        onChange={(e) => onCount(e.target.value)}
        className="[&_input]:min-h-12 [&_input]:text-base"
      />
    </div>
  );
}
