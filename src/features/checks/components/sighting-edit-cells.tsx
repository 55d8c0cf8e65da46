// Inline editors for the review table: pest from the library, count as a number. Enter or leaving the
// input saves, Escape puts the old value back.
import { useEffect, useState } from 'react';
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import type { useUpdateSighting } from '../../../lib/api/update-sighting.ts';
import { PestOptions } from '../../../components/pest-options.tsx';

type Update = ReturnType<typeof useUpdateSighting>;
const editorClass =
  'rounded border-0 bg-transparent px-1 py-0.5 text-sm ring-1 ring-inset ring-transparent hover:ring-soil-300 focus:bg-white focus:ring-2 focus:ring-field-600 disabled:opacity-60';

/** `walkDay` is the sighting's walk day as the organisation writes dates, naming the editor for a screen reader. */
export function PestEditor({
  sighting,
  walkDay,
  pests,
  crop,
  update,
}: {
  sighting: SightingView;
  walkDay: string;
  pests: Pest[];
  crop?: string;
  update: Update;
}) {
  const busy = update.isPending && update.variables?.sightingId === sighting.id;
  const known = pests.some((p) => p.id === sighting.pestId);
  return (
    <select
      aria-label={`Pest of sighting from ${walkDay}`}
      className={`${editorClass} max-w-[11rem]`}
      value={sighting.pestId}
      disabled={busy}
      onChange={(e) => update.mutate({ sightingId: sighting.id, change: { pestId: e.target.value } })}
    >
      {!known && <option value={sighting.pestId}>{sighting.pestName}</option>}
      <PestOptions pests={pests} crop={crop} />
    </select>
  );
}

export function CountEditor({ sighting, walkDay, update }: { sighting: SightingView; walkDay: string; update: Update }) {
  const shown = sighting.count === null ? '' : String(sighting.count);
  const [text, setText] = useState(shown);
  useEffect(() => setText(shown), [shown]);
  const busy = update.isPending && update.variables?.sightingId === sighting.id;
  const failed = update.isError && update.variables?.sightingId === sighting.id;
  const save = () => {
    if (text === shown) return;
    const count = text.trim() === '' ? null : Number(text);
    if (count !== null && !Number.isFinite(count)) {
      setText(shown);
      return;
    }
    update.mutate({ sightingId: sighting.id, change: { count } });
  };
  if (sighting.isEmptyStop)
    return (
      <span className="px-1 tabular-nums text-soil-500" title="Empty stop: nothing found">
        0
      </span>
    );
  return (
    <input
      aria-label={`Count of sighting from ${walkDay}`}
      aria-invalid={failed || undefined}
      inputMode="decimal"
      className={`${editorClass} w-16 text-right tabular-nums aria-[invalid=true]:ring-patch-600`}
      value={text}
      placeholder="—"
      disabled={busy}
      onChange={(e) => setText(e.target.value)}
      onBlur={save}
      onKeyDown={(e) => {
        if (e.key === 'Enter') e.currentTarget.blur();
        if (e.key === 'Escape') setText(shown);
      }}
    />
  );
}
