// The scout's correction of one sighting from the walk's list: another pest, or another count. Phone-sized
// targets; only what changed is sent. An empty stop keeps its zero (changing it would make it a finding).
import { useState, type FormEvent } from 'react';
import type { QueryKey } from '@tanstack/react-query';
import type { SightingUpdateInput, SightingView } from '@shared/schemas/sightings.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, SelectField, TextField } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useUpdateSighting } from '../../../lib/api/update-sighting.ts';
import { PestOptions } from '../../../components/pest-options.tsx';

/** What the scout changed, or a sentence saying what to fix in the count. */
function changeFrom(sighting: SightingView, pestId: string, countText: string): SightingUpdateInput | string {
  const change: SightingUpdateInput = {};
  if (pestId !== sighting.pestId) change.pestId = pestId;
  if (!sighting.isEmptyStop) {
    const count = countText.trim() === '' ? null : Number(countText);
    if (count !== null && (!Number.isFinite(count) || count < 0)) return 'Enter the count as a number of 0 or more, or leave it blank.';
    if (count !== sighting.count) change.count = count;
  }
  return change;
}

export function SightingCorrectionForm({
  sighting,
  pests,
  crop,
  shownUnder,
  onDone,
}: {
  sighting: SightingView;
  pests: Pest[];
  /** The field's crop: its pests lead the list. */
  crop?: string;
  shownUnder: QueryKey;
  onDone: () => void;
}) {
  const [pestId, setPestId] = useState(sighting.pestId);
  const [countText, setCountText] = useState(sighting.count === null ? '' : String(sighting.count));
  const [countError, setCountError] = useState<string>();
  const update = useUpdateSighting(shownUnder);
  const pest = pests.find((p) => p.id === pestId);

  const save = (event: FormEvent) => {
    event.preventDefault();
    const change = changeFrom(sighting, pestId, countText);
    if (typeof change === 'string') return setCountError(change);
    setCountError(undefined);
    if (Object.keys(change).length === 0) return onDone();
    update.mutate({ sightingId: sighting.id, change }, { onSuccess: onDone });
  };

  return (
    <form
      onSubmit={save}
      className="mt-3 space-y-3 rounded-lg bg-straw-50 p-3 ring-1 ring-inset ring-straw-300"
      aria-label={`Correct the sighting: ${sighting.pestName}`}
    >
      <SelectField label="Pest" value={pestId} onChange={(e) => setPestId(e.target.value)} className="[&_select]:min-h-12 [&_select]:text-base">
        {!pests.some((p) => p.id === sighting.pestId) && <option value={sighting.pestId}>{sighting.pestName}</option>}
        <PestOptions pests={pests} crop={crop} label={(p) => `${p.name} (${p.countUnit})`} />
      </SelectField>
      {!sighting.isEmptyStop && (
        <TextField
          label="Count"
          hint={pest ? `${pest.countUnit}; leave blank if you did not count` : 'Leave blank if you did not count'}
          inputMode="decimal"
          type="number"
          min={0}
          step="any"
          value={countText}
          onChange={(e) => setCountText(e.target.value)}
          error={countError}
          className="[&_input]:min-h-12 [&_input]:text-base"
        />
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" busy={update.isPending}>
          Save the correction
        </Button>
        <Button variant="secondary" size="lg" onClick={onDone} disabled={update.isPending}>
          Cancel
        </Button>
      </div>
      {update.isError && <FormMessage>{errorMessage(update.error)}</FormMessage>}
    </form>
  );
}
