// The pest and date window under review: everything on the page follows these three choices.
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { PestOptions } from '../../../components/pest-options.tsx';

const controlClass = 'block rounded-md border-0 bg-white px-2.5 py-1.5 text-sm text-soil-900 ring-1 ring-inset ring-soil-300 focus:ring-2 focus:ring-field-600';

export interface ReviewWindow {
  pestId?: string;
  from?: string;
  to?: string;
}

export function ReviewToolbar({
  pests,
  crop,
  window,
  onChange,
  summary,
}: {
  pests: Pest[];
  /** The field's crop: its pests come first in the choice. */
  crop: string;
  window: ReviewWindow;
  onChange: (window: ReviewWindow) => void;
  summary: string;
}) {
  const set = (key: keyof ReviewWindow, value: string) => onChange({ ...window, [key]: value || undefined });
  return (
    <div className="flex flex-wrap items-end gap-3 rounded-lg bg-white px-4 py-3 shadow-sm ring-1 ring-soil-300/60">
      <label className="text-xs font-medium text-soil-700">
        Pest under review
        <select className={`${controlClass} mt-0.5 min-w-[14rem]`} value={window.pestId ?? ''} onChange={(e) => set('pestId', e.target.value)}>
          {!window.pestId && <option value="">Choose a pest…</option>}
          <PestOptions pests={pests} crop={crop} />
        </select>
      </label>
      <label className="text-xs font-medium text-soil-700">
        From
        <input type="date" className={`${controlClass} mt-0.5`} value={window.from ?? ''} max={window.to} onChange={(e) => set('from', e.target.value)} />
      </label>
      <label className="text-xs font-medium text-soil-700">
        To
        <input type="date" className={`${controlClass} mt-0.5`} value={window.to ?? ''} min={window.from} onChange={(e) => set('to', e.target.value)} />
      </label>
      <p className="ml-auto text-sm text-soil-700" aria-live="polite">
        {summary}
      </p>
    </div>
  );
}
