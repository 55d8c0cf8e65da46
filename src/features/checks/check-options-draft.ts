// The check options as the adviser types them (text in inputs) and their reading as engine options, checked
// with the engine's own option schema before anything is sent.
import { analysisOptionsSchema, type AnalysisOptionsInput } from '@shared/analysis/options.ts';
import { zodFieldErrors, type FieldErrors } from '../../lib/form-errors.ts';

export interface CheckOptionsDraft {
  cellSizeM: string;
  simulations: string;
  kernel: 'quartic' | 'gaussian';
  bandwidthM: string;
  alpha: string;
  areaBasis: 'boundary' | 'bbox' | 'hull' | 'custom';
  customAreaHa: string;
}

export const defaultDraft: CheckOptionsDraft = {
  cellSizeM: '',
  simulations: '999',
  kernel: 'quartic',
  bandwidthM: '',
  alpha: '0.05',
  areaBasis: 'boundary',
  customAreaHa: '',
};

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
