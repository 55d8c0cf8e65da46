// Create or edit a field: its details and a boundary from a file (.geojson, .json, .kml) or drawn on the map.
import { useState, type FormEvent } from 'react';
import type { MultiPolygon } from 'geojson';
import { fieldCreateSchema, fieldUpdateSchema } from '@shared/schemas/fields.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextField } from '../../../components/form-field.tsx';
import { MapFrame } from '../../../components/map-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import { useCreateField } from '../api/create-field.ts';
import { useUpdateField } from '../api/update-field.ts';
import { BoundaryDraw } from './boundary-draw.tsx';
import { previewBoundary, previewDrawn, type BoundaryPreview } from './boundary-preview.ts';

type Source = 'file' | 'draw';
interface UploadedFile {
  name: string;
  text: string;
  preview: BoundaryPreview;
}

export function FieldForm({ farmId, field, onSaved }: { farmId: string; field?: Field; onSaved: (field: Field) => void }) {
  const create = useCreateField();
  const update = useUpdateField();
  const saving = create.isPending || update.isPending;
  const failure = create.error ?? update.error;
  const [details, setDetails] = useState({ name: field?.name ?? '', crop: field?.crop ?? '', season: String(field?.season ?? new Date().getFullYear()) });
  const [source, setSource] = useState<Source>('file');
  const [file, setFile] = useState<UploadedFile | null>(null);
  const [drawn, setDrawn] = useState<MultiPolygon | null>(null);
  const [errors, setErrors] = useState<FieldErrors>({});

  const shownBoundary: MultiPolygon | null = source === 'file' ? (file?.preview.ok ? file.preview.boundary : (field?.boundary ?? null)) : (drawn ?? null);
  const drawnPreview = source === 'draw' && drawn ? previewDrawn(drawn) : null;
  const preview = source === 'file' ? file?.preview : drawnPreview;

  const readFile = async (picked: File | undefined) => {
    if (!picked) return setFile(null);
    const text = await picked.text();
    setFile({ name: picked.name, text, preview: previewBoundary(text) });
    setErrors((e) => ({ ...e, boundary: '' }));
  };

  const chooseSource = (next: Source) => {
    setSource(next);
    // Drawing starts from the uploaded or saved outline, which counts as the drawn boundary until edited.
    if (next === 'draw') setDrawn(file?.preview.ok ? file.preview.boundary : (field?.boundary ?? null));
  };

  const boundaryBody = () => {
    if (source === 'file' && file) return { boundaryFile: file.text };
    if (source === 'draw' && drawn) return { boundary: drawn };
    return {};
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const body = { ...details, ...boundaryBody() };
    const checked = field ? checkForm(fieldUpdateSchema, body) : checkForm(fieldCreateSchema, { ...body, farmId });
    const found: FieldErrors = checked.ok ? {} : checked.errors;
    if (!field && !('boundaryFile' in body) && !('boundary' in body)) found.boundary = 'Upload a boundary file or draw the boundary on the map.';
    // The browser already found the boundary's fault: say it beside the map instead of asking the server.
    if (preview && !preview.ok) found.boundary = preview.message;
    if (Object.keys(found).length || !checked.ok) return setErrors(found);
    setErrors({});
    const options = { onSuccess: onSaved, onError: (error: Error) => setErrors(serverFieldErrors(error)) };
    if (field) update.mutate({ id: field.id, ...(checked.value as object) }, options);
    else create.mutate(checked.value as Parameters<typeof create.mutate>[0], options);
  };

  const boundaryError = errors.boundary || errors.boundaryFile;
  return (
    <form onSubmit={submit} noValidate className="space-y-6">
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Field name" name="name" value={details.name} error={errors.name} onChange={(e) => setDetails({ ...details, name: e.target.value })} />
        <TextField
          label="Crop"
          name="crop"
          hint="For example soybean, corn, winter wheat"
          value={details.crop}
          error={errors.crop}
          onChange={(e) => setDetails({ ...details, crop: e.target.value })}
        />
        <TextField
          label="Season"
          name="season"
          inputMode="numeric"
          hint="The harvest year"
          value={details.season}
          error={errors.season}
          onChange={(e) => setDetails({ ...details, season: e.target.value })}
        />
      </div>

      <fieldset className="space-y-3">
        <legend className="text-base font-semibold text-field-900">Boundary{field ? ' (leave as is to keep the saved one)' : ''}</legend>
        <div role="radiogroup" aria-label="Boundary from" className="inline-flex rounded-md bg-straw-100 p-1">
          {(['file', 'draw'] as const).map((option) => (
            <label
              key={option}
              className={`cursor-pointer rounded px-3 py-1.5 text-sm font-medium has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-field-600 ${source === option ? 'bg-white text-field-800 shadow-sm' : 'text-soil-700'}`}
            >
              <input type="radio" name="boundary-source" value={option} checked={source === option} onChange={() => chooseSource(option)} className="sr-only" />
              {option === 'file' ? 'Upload a file' : 'Draw on the map'}
            </label>
          ))}
        </div>

        {source === 'file' ? (
          <div>
            <label htmlFor="boundary-file" className="mb-1 block text-sm font-medium text-soil-800">
              Boundary file
            </label>
            <input
              id="boundary-file"
              name="boundary-file"
              type="file"
              accept=".geojson,.json,.kml,application/geo+json,application/json,application/vnd.google-earth.kml+xml"
              aria-describedby="boundary-file-hint"
              onChange={(e) => void readFile(e.target.files?.[0])}
              className="block w-full text-sm text-soil-700 file:mr-3 file:min-h-10 file:rounded-md file:border-0 file:bg-field-700 file:px-4 file:font-medium file:text-white hover:file:bg-field-800"
            />
            <p id="boundary-file-hint" className="mt-1 text-xs text-soil-600">
              GeoJSON (Polygon, MultiPolygon, Feature or FeatureCollection) or KML, longitude and latitude in WGS 84.
            </p>
          </div>
        ) : (
          <p className="text-sm text-soil-700">
            Use the polygon or rectangle tool at the map's top left; drag corners to adjust, or cut holes for ponds and yards.
          </p>
        )}

        {preview?.ok && (
          <p className="text-sm text-field-800" role="status">
            {source === 'file' ? `${file?.name}: ` : 'Drawn boundary: '}
            <AreaText m2={preview.areaM2} />
          </p>
        )}
        {preview && !preview.ok && <FormMessage>{preview.message}</FormMessage>}
        {boundaryError && boundaryError !== (preview && !preview.ok ? preview.message : '') && <FormMessage>{boundaryError}</FormMessage>}

        <MapFrame
          key={source}
          boundaries={source === 'file' && shownBoundary ? [{ id: file?.name ?? 'saved', geometry: shownBoundary }] : []}
          label="Field boundary"
          className="h-80 sm:h-[26rem]"
        >
          {source === 'draw' && <BoundaryDraw initial={file?.preview.ok ? file.preview.boundary : (field?.boundary ?? null)} onChange={setDrawn} />}
        </MapFrame>
      </fieldset>

      {failure && !Object.keys(serverFieldErrors(failure)).length && <FormMessage>{errorMessage(failure)}</FormMessage>}
      <div className="flex gap-2">
        <Button type="submit" size="lg" busy={saving}>
          {field ? 'Save changes' : 'Save field'}
        </Button>
      </div>
    </form>
  );
}
