// The adviser's options for a pattern check, validated with the engine's own option schema before sending.
import { useId, type ReactNode } from 'react';
import { analysisOptionsSchema, type AnalysisOptionsInput } from '@shared/analysis/options.ts';
import { zodFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';

export interface CheckOptionsDraft {
  cellSizeM: string;
  simulations: string;
  kernel: 'quartic' | 'gaussian';
  bandwidthM: string;
  alpha: string;
  areaBasis: 'boundary' | 'bbox' | 'hull' | 'custom';
  customAreaHa: string;
}

export const defaultDraft: CheckOptionsDraft = { cellSizeM: '', simulations: '999', kernel: 'quartic', bandwidthM: '', alpha: '0.05', areaBasis: 'boundary', customAreaHa: '' };

const M2_PER_HA = 10_000;
const numberOrUndefined = (text: string) => (text.trim() === '' ? undefined : Number(text));

/** The draft as engine options, or the messages to show beside each input. */
export function optionsFromDraft(draft: CheckOptionsDraft): { ok: true; options: AnalysisOptionsInput } | { ok: false; errors: FieldErrors } {
  const customArea = numberOrUndefined(draft.customAreaHa);
  const options: AnalysisOptionsInput = {
    cellSizeM: numberOrUndefined(draft.cellSizeM),
    simulations: numberOrUndefined(draft.simulations),
    kernel: draft.kernel,
    bandwidthM: numberOrUndefined(draft.bandwidthM),
    alpha: numberOrUndefined(draft.alpha),
    areaBasis: draft.areaBasis,
    customAreaM2: draft.areaBasis === 'custom' && customArea !== undefined ? customArea * M2_PER_HA : undefined,
  };
  const parsed = analysisOptionsSchema.safeParse(options);
  if (parsed.success) return { ok: true, options };
  const errors = zodFieldErrors(parsed.error);
  if (errors.customAreaM2) errors.customAreaHa = errors.customAreaM2.replace('m²', 'ha');
  return { ok: false, errors };
}

const inputClass = 'block w-full rounded border-0 bg-white px-2 py-1 text-sm text-soil-900 ring-1 ring-inset ring-soil-300 focus:ring-2 focus:ring-field-600 aria-[invalid=true]:ring-patch-600';

function Option({ label, hint, error, children }: { label: string; hint?: ReactNode; error?: string; children: (id: string, describedBy?: string) => ReactNode }) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={id} className="mb-0.5 block text-xs font-medium text-soil-800">
        {label}
      </label>
      {children(id, describedBy)}
      {hint && (
        <p id={`${id}-hint`} className="mt-0.5 text-[11px] leading-snug text-soil-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="mt-0.5 text-xs font-medium text-patch-700">
          {error}
        </p>
      )}
    </div>
  );
}

export function CheckOptionsForm({ draft, onChange, errors }: { draft: CheckOptionsDraft; onChange: (draft: CheckOptionsDraft) => void; errors: FieldErrors }) {
  const set = <K extends keyof CheckOptionsDraft>(key: K, value: CheckOptionsDraft[K]) => onChange({ ...draft, [key]: value });
  const text = (key: 'cellSizeM' | 'simulations' | 'bandwidthM' | 'alpha' | 'customAreaHa', placeholder?: string) => (id: string, describedBy?: string) => (
    <input id={id} inputMode="decimal" className={inputClass} value={draft[key]} placeholder={placeholder} aria-invalid={errors[key === 'customAreaHa' ? 'customAreaHa' : key] ? true : undefined} aria-describedby={describedBy} onChange={(e) => set(key, e.target.value)} />
  );
  return (
    <div className="grid grid-cols-2 gap-x-3 gap-y-2">
      <Option label="Area basis" error={errors.areaBasis} hint="The area chance spacing is judged against.">
        {(id, describedBy) => (
          <select id={id} className={inputClass} value={draft.areaBasis} aria-describedby={describedBy} onChange={(e) => set('areaBasis', e.target.value as CheckOptionsDraft['areaBasis'])}>
            <option value="boundary">Field boundary</option>
            <option value="bbox">Bounding rectangle</option>
            <option value="hull">Convex hull</option>
            <option value="custom">Custom area</option>
          </select>
        )}
      </Option>
      {draft.areaBasis === 'custom' ? (
        <Option label="Custom area (ha)" error={errors.customAreaHa}>
          {text('customAreaHa', 'e.g. 32.5')}
        </Option>
      ) : (
        <Option label="Significance α" error={errors.alpha} hint="0.05 = 1 in 20 risk of calling chance a pattern.">
          {text('alpha')}
        </Option>
      )}
      <Option label="Quadrat cell size (m)" error={errors.cellSizeM} hint="Blank: cell area ≈ 2 × field area ÷ sightings.">
        {text('cellSizeM', 'default')}
      </Option>
      <Option label="Simulations" error={errors.simulations} hint="Random scatters for the Monte Carlo p; more = steadier p, slower.">
        {text('simulations')}
      </Option>
      <Option label="Kernel" error={errors.kernel}>
        {(id, describedBy) => (
          <select id={id} className={inputClass} value={draft.kernel} aria-describedby={describedBy} onChange={(e) => set('kernel', e.target.value as CheckOptionsDraft['kernel'])}>
            <option value="quartic">Quartic</option>
            <option value="gaussian">Gaussian</option>
          </select>
        )}
      </Option>
      <Option
        label="Bandwidth (m)"
        error={errors.bandwidthM}
        hint={draft.kernel === 'quartic' ? 'Quartic: the search radius — each sighting counts up to this distance, zero beyond it.' : 'Gaussian: the standard deviation — each sighting’s weight fades with distance, never quite zero.'}
      >
        {text('bandwidthM', 'default')}
      </Option>
      {draft.areaBasis === 'custom' && (
        <Option label="Significance α" error={errors.alpha} hint="0.05 = 1 in 20 risk of calling chance a pattern.">
          {text('alpha')}
        </Option>
      )}
    </div>
  );
}
