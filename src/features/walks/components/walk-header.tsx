// Whose walk, where and when, and the scout's notes (saved on request, not on every keystroke).
import { useEffect, useState } from 'react';
import { Link } from 'react-router';
import type { WalkView } from '@shared/schemas/walks.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextAreaField } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useUpdateWalk } from '../api/update-walk.ts';
import { scoutPaths } from '../paths.ts';
import { useDates } from '../../../lib/dates.ts';

export function WalkHeader({ walk, farmName }: { walk: WalkView; farmName?: string }) {
  const dates = useDates();
  const [notes, setNotes] = useState(walk.notes);
  const update = useUpdateWalk(walk.id);
  useEffect(() => setNotes(walk.notes), [walk.notes]);
  const changed = notes !== walk.notes;

  return (
    <div className="space-y-3">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-base">
        <dt className="text-sm text-soil-600">Field</dt>
        <dd className="font-semibold text-soil-900">
          <Link to={scoutPaths.field(walk.fieldId)} className="underline decoration-field-400 underline-offset-4">
            {walk.fieldName}
          </Link>
          {farmName && <span className="block text-sm font-normal text-soil-700">{farmName}</span>}
        </dd>
        <dt className="text-sm text-soil-600">Date</dt>
        <dd className="font-semibold text-soil-900">{dates.calendarDate(walk.walkedOn)}</dd>
        <dt className="text-sm text-soil-600">Scout</dt>
        <dd className="font-semibold text-soil-900">{walk.scoutName}</dd>
        <dt className="text-sm text-soil-600">So far</dt>
        <dd className="font-semibold text-soil-900" data-testid="walk-totals">
          {walk.sightingCount} {walk.sightingCount === 1 ? 'sighting' : 'sightings'}, {walk.stopCount} empty {walk.stopCount === 1 ? 'stop' : 'stops'}
        </dd>
      </dl>
      <TextAreaField
        label="Notes"
        value={notes}
        onChange={(e) => setNotes(e.target.value)}
        placeholder="Crop stage, weather, anything the adviser should know"
        className="[&_textarea]:text-base"
      />
      {update.isError && <FormMessage>{errorMessage(update.error)}</FormMessage>}
      {changed && (
        <Button size="lg" variant="secondary" busy={update.isPending} onClick={() => update.mutate({ notes })}>
          Save notes
        </Button>
      )}
    </div>
  );
}
