// The organisation's locale and time zone, with a preview of how dates will read before the admin saves them.
import { useMemo, useState, type FormEvent } from 'react';
import { datesIn, type DateFormat } from '@shared/dates/format-dates.ts';
import { dateFormatSchema } from '@shared/schemas/date-format.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage, SelectField } from '../../../components/form-field.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useAppConfig } from '../../../lib/app-config.ts';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useUpdateDateFormat } from '../api/update-date-format.ts';
import { localeChoices, localeLabel, timeZoneGroups, zoneLabel } from '../date-choices.ts';

// One fixed moment for the preview, so the admin compares like with like: an afternoon in UTC shows 12- or 24-hour clocks
// and, in zones far from UTC, a different calendar day.
const EXAMPLE_MOMENT = '2026-07-14T20:30:00Z';

function Preview({ format }: { format: DateFormat }) {
  const dates = datesIn(format);
  return (
    <div aria-live="polite" className="rounded-md bg-straw-50 p-3 ring-1 ring-inset ring-straw-200">
      <p className="text-sm text-soil-700">How Patchwise will write one example moment:</p>
      <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]">
        <dt className="text-soil-600">Date</dt>
        <dd data-testid="preview-date" className="font-medium text-soil-900">
          {dates.date(EXAMPLE_MOMENT)}
        </dd>
        <dt className="text-soil-600">Date and time</dt>
        <dd data-testid="preview-date-time" className="font-medium text-soil-900">
          {dates.dateTime(EXAMPLE_MOMENT)}
        </dd>
      </dl>
    </div>
  );
}

function DateSettingsForm({ saved }: { saved: DateFormat }) {
  const update = useUpdateDateFormat();
  const [values, setValues] = useState<DateFormat>(saved);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [done, setDone] = useState<DateFormat | null>(null);
  const locales = useMemo(() => localeChoices(saved.locale), [saved.locale]);
  const zoneGroups = useMemo(() => timeZoneGroups(saved.timeZone), [saved.timeZone]);
  const change = (key: keyof DateFormat) => (e: { target: { value: string } }) => {
    setValues({ ...values, [key]: e.target.value });
    setDone(null);
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(dateFormatSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    update.mutate(checked.value, { onSuccess: setDone, onError: (error) => setErrors(serverFieldErrors(error)) });
  };

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Dates and times">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Language and region"
          hint="Decides the order of day and month, the month names and the 12- or 24-hour clock."
          value={values.locale}
          error={errors.locale}
          onChange={change('locale')}
        >
          {locales.map((tag) => (
            <option key={tag} value={tag}>
              {localeLabel(tag)}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Time zone"
          hint="Times and calendar days are those of this zone, wherever the reader is."
          value={values.timeZone}
          error={errors.timeZone}
          onChange={change('timeZone')}
        >
          {zoneGroups.map((group) => (
            <optgroup key={group.region} label={group.region}>
              {group.zones.map((zone) => (
                <option key={zone} value={zone}>
                  {zoneLabel(zone)}
                </option>
              ))}
            </optgroup>
          ))}
        </SelectField>
      </div>
      <Preview format={values} />
      {update.isError && <FormMessage>{errorMessage(update.error)}</FormMessage>}
      {done && (
        <FormMessage tone="success">
          Saved. Dates across Patchwise, in the app and in e-mails, are now written in {localeLabel(done.locale)} for the {done.timeZone} time zone.
        </FormMessage>
      )}
      <Button type="submit" busy={update.isPending}>
        Save dates and times
      </Button>
    </form>
  );
}

export function DateSettingsPage() {
  const config = useAppConfig();
  return (
    <PageFrame title="Dates and times" eyebrow="How Patchwise writes dates for your organisation">
      <Panel>
        {config.isPending ? (
          <LoadingState label="Loading your settings…" />
        ) : config.isError ? (
          <ErrorState error={config.error} onRetry={() => config.refetch()} />
        ) : (
          <DateSettingsForm saved={config.data.dateFormat} />
        )}
      </Panel>
    </PageFrame>
  );
}
