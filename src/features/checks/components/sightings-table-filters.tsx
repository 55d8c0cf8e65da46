// Filters for the review table; the choices come from the sightings themselves, so none leads nowhere.
import { useMemo } from 'react';
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { useDates } from '../../../lib/dates.ts';
import { useWalksOfDays } from '../../../lib/api/get-walks.ts';
import { walkFinishMark } from '../../../lib/walk-finish-mark.ts';
import { walkChoices } from '../walk-choices.ts';

export interface TableFilters {
  pestId?: string;
  scoutId?: string;
  walkId?: string;
  from?: string;
  to?: string;
}

const controlClass = 'block w-full rounded border-0 bg-white px-2 py-1 text-sm ring-1 ring-inset ring-soil-300 focus:ring-2 focus:ring-field-600';

/** One of the table's pick-one filters: its first choice, the empty value, keeps every row. */
function ChoiceFilter({
  label,
  everyLabel,
  value,
  choices,
  onChange,
}: {
  label: string;
  everyLabel: string;
  value: string | undefined;
  choices: ReadonlyArray<readonly [string, string]>;
  onChange: (value: string) => void;
}) {
  return (
    <label className="text-xs font-medium text-soil-700">
      {label}
      <select className={controlClass} value={value ?? ''} onChange={(e) => onChange(e.target.value)}>
        <option value="">{everyLabel}</option>
        {choices.map(([id, name]) => (
          <option key={id} value={id}>
            {name}
          </option>
        ))}
      </select>
    </label>
  );
}

/** The finish mark of each walk among the sightings, from that field's walks over the days the sightings span. */
function useWalkFinishMarks(sightings: readonly SightingView[]) {
  const dates = useDates();
  const fieldId = sightings[0]?.fieldId;
  let from: string | undefined;
  let to: string | undefined;
  for (const s of sightings) {
    // YYYY-MM-DD compares as text in calendar order.
    if (!from || s.walkedOn < from) from = s.walkedOn;
    if (!to || s.walkedOn > to) to = s.walkedOn;
  }
  const walks = useWalksOfDays({ fieldId, from, to }, Boolean(fieldId));
  return useMemo(() => {
    // The organisation's calendar day: a desk page reads walks as the business's day, wherever the viewer sits.
    const today = dates.today();
    const marks = new Map((walks.data ?? []).map((w) => [w.id, walkFinishMark(w, today, dates)]));
    return (walkId: string) => marks.get(walkId) ?? null;
  }, [walks.data, dates]);
}

export function SightingsTableFilters({
  sightings,
  pests,
  filters,
  onChange,
}: {
  sightings: SightingView[];
  pests: Pest[];
  filters: TableFilters;
  onChange: (filters: TableFilters) => void;
}) {
  const dates = useDates();
  const finishMarkOf = useWalkFinishMarks(sightings);
  const choices = useMemo(() => {
    const scouts = new Map<string, string>();
    const pestNames = new Map<string, string>(pests.map((p) => [p.id, p.name]));
    const pestIds = new Set<string>();
    for (const s of sightings) {
      scouts.set(s.scoutId, s.scoutName);
      pestIds.add(s.pestId);
      if (!pestNames.has(s.pestId)) pestNames.set(s.pestId, s.pestName);
    }
    const sorted = (m: Map<string, string>) => [...m.entries()].sort((a, b) => a[1].localeCompare(b[1]));
    return {
      scouts: sorted(scouts),
      walks: walkChoices(sightings, dates, finishMarkOf),
      pests: [...pestIds].map((id) => [id, pestNames.get(id)!] as const).sort((a, b) => a[1].localeCompare(b[1])),
    };
  }, [sightings, pests, dates, finishMarkOf]);
  const set = (key: keyof TableFilters, value: string) => onChange({ ...filters, [key]: value || undefined });
  return (
    <fieldset className="grid grid-cols-2 gap-2 sm:grid-cols-5">
      <legend className="sr-only">Filter sightings</legend>
      <ChoiceFilter label="Pest" everyLabel="Every pest" value={filters.pestId} choices={choices.pests} onChange={(v) => set('pestId', v)} />
      <ChoiceFilter label="Scout" everyLabel="Every scout" value={filters.scoutId} choices={choices.scouts} onChange={(v) => set('scoutId', v)} />
      <ChoiceFilter label="Walk" everyLabel="Every walk" value={filters.walkId} choices={choices.walks} onChange={(v) => set('walkId', v)} />
      <label className="text-xs font-medium text-soil-700">
        Walked from
        <input type="date" className={controlClass} value={filters.from ?? ''} onChange={(e) => set('from', e.target.value)} />
      </label>
      <label className="text-xs font-medium text-soil-700">
        Walked to
        <input type="date" className={controlClass} value={filters.to ?? ''} onChange={(e) => set('to', e.target.value)} />
      </label>
    </fieldset>
  );
}
