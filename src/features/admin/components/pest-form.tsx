import { useState, type FormEvent } from 'react';
import { pestKinds, pestSchema, pestUpdateSchema, thresholdBases } from '@shared/schemas/pests.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, SelectField, TextAreaField, TextField } from '../../../components/form-field.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { useCreatePest } from '../api/create-pest.ts';
import { useUpdatePest } from '../api/update-pest.ts';
import { thresholdBasisLabel } from './threshold-text.tsx';

const kindLabels = { insect: 'Insect', disease: 'Disease', weed: 'Weed' } as const;
/** The crops box holds names separated by commas; blanks between commas are not crops. */
const cropList = (text: string) =>
  text
    .split(',')
    .map((c) => c.trim())
    .filter(Boolean);

export function PestForm({ pest, onDone }: { pest?: Pest; onDone: () => void }) {
  const create = useCreatePest();
  const update = useUpdatePest();
  const [values, setValues] = useState({
    name: pest?.name ?? '',
    kind: pest?.kind ?? 'insect',
    countUnit: pest?.countUnit ?? '',
    actionThreshold: pest ? String(pest.actionThreshold) : '',
    thresholdBasis: pest?.thresholdBasis ?? 'mean',
    thresholdNote: pest?.thresholdNote ?? '',
    thresholdSource: pest?.thresholdSource ?? '',
    crops: pest?.crops.join(', ') ?? '',
  });
  const [errors, setErrors] = useState<FieldErrors>({});
  const set = (key: keyof typeof values) => (e: { target: { value: string } }) => setValues({ ...values, [key]: e.target.value });
  const failure = create.error ?? update.error;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    // An empty number box must read as missing, not as zero.
    const body = { ...values, actionThreshold: values.actionThreshold.trim() === '' ? undefined : values.actionThreshold, crops: cropList(values.crops) };
    const checked = pest ? checkForm(pestUpdateSchema, body) : checkForm(pestSchema, body);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    const options = { onSuccess: onDone, onError: (error: Error) => setErrors(serverFieldErrors(error)) };
    if (pest) update.mutate({ id: pest.id, ...checked.value }, options);
    else create.mutate(checked.value as Parameters<typeof create.mutate>[0], options);
  };

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 sm:grid-cols-2">
      <TextField label="Pest name" value={values.name} error={errors.name} onChange={set('name')} />
      <SelectField label="Kind" value={values.kind} error={errors.kind} onChange={set('kind')}>
        {pestKinds.map((k) => (
          <option key={k} value={k}>
            {kindLabels[k]}
          </option>
        ))}
      </SelectField>
      <TextField label="Count unit" hint='For example "aphids per plant"' value={values.countUnit} error={errors.countUnit} onChange={set('countUnit')} />
      <TextField
        label="Crops"
        hint="The crops this pest is scouted in, separated by commas, written as the fields name their crop"
        value={values.crops}
        error={errors.crops ?? Object.entries(errors).find(([key]) => key.startsWith('crops.'))?.[1]}
        onChange={set('crops')}
      />
      <div className="grid grid-cols-2 gap-3">
        <TextField
          label="Action threshold"
          inputMode="decimal"
          value={values.actionThreshold}
          error={errors.actionThreshold}
          onChange={set('actionThreshold')}
        />
        <SelectField label="Applies to" value={values.thresholdBasis} error={errors.thresholdBasis} onChange={set('thresholdBasis')}>
          {thresholdBases.map((b) => (
            <option key={b} value={b}>
              {thresholdBasisLabel(b)}
            </option>
          ))}
        </SelectField>
      </div>
      <TextField
        label="Source of the threshold"
        hint="Publication or extension service, and year"
        value={values.thresholdSource}
        error={errors.thresholdSource}
        onChange={set('thresholdSource')}
        className="sm:col-span-2"
      />
      <TextAreaField
        label="Note"
        hint="Crop stage, conditions, anything the number alone does not say"
        value={values.thresholdNote}
        error={errors.thresholdNote}
        onChange={set('thresholdNote')}
        className="sm:col-span-2"
      />
      {failure && (
        <div className="sm:col-span-2">
          <FormMessage>{errorMessage(failure)}</FormMessage>
        </div>
      )}
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" busy={create.isPending || update.isPending}>
          {pest ? 'Save pest' : 'Add to the library'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
