// The adviser's options for a pattern check; check-options-draft.ts reads them with the engine's own option schema.
import { useId, type ReactNode } from 'react';
import type { FieldErrors } from '../../../lib/form-errors.ts';
import type { CheckOptionsDraft } from '../check-options-draft.ts';

const inputClass =
  'block w-full rounded border-0 bg-white px-2 py-1 text-sm text-soil-900 ring-1 ring-inset ring-soil-300 focus:ring-2 focus:ring-field-600 aria-[invalid=true]:ring-patch-600';

function Option({
  label,
  hint,
  error,
  children,
}: {
  label: string;
  hint?: ReactNode;
  error?: string;
  children: (id: string, describedBy?: string) => ReactNode;
}) {
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
    <input
      id={id}
      inputMode="decimal"
      className={inputClass}
      value={draft[key]}
      placeholder={placeholder}
      aria-invalid={errors[key === 'customAreaHa' ? 'customAreaHa' : key] ? true : undefined}
      aria-describedby={describedBy}
      onChange={(e) => set(key, e.target.value)}
    />
  );
  return (
    <div className="grid grid-cols-2 gap-x-3 gap-y-2">
      <Option label="Area basis" error={errors.areaBasis} hint="The area chance spacing is judged against.">
        {(id, describedBy) => (
          <select
            id={id}
            className={inputClass}
            value={draft.areaBasis}
            aria-describedby={describedBy}
            onChange={(e) => set('areaBasis', e.target.value as CheckOptionsDraft['areaBasis'])}
          >
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
          <select
            id={id}
            className={inputClass}
            value={draft.kernel}
            aria-describedby={describedBy}
            onChange={(e) => set('kernel', e.target.value as CheckOptionsDraft['kernel'])}
          >
            <option value="quartic">Quartic</option>
            <option value="gaussian">Gaussian</option>
          </select>
        )}
      </Option>
      <Option
        label="Bandwidth (m)"
        error={errors.bandwidthM}
        hint={
          draft.kernel === 'quartic'
            ? 'Quartic: the search radius — each sighting counts up to this distance, zero beyond it.'
            : 'Gaussian: the standard deviation — each sighting’s weight fades with distance, never quite zero.'
        }
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
