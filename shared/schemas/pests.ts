import { z } from 'zod';
import { oneLineNameSchema } from './one-line-name.ts';

export const pestKinds = ['insect', 'disease', 'weed'] as const;
export type PestKind = (typeof pestKinds)[number];
/** Whether the action threshold applies to the mean count per stop or to the share of stops infested. */
export const thresholdBases = ['mean', 'incidence'] as const;
export type ThresholdBasis = (typeof thresholdBases)[number];

const pestFields = {
  name: oneLineNameSchema('Enter the pest name.', 120, 'Keep the pest name to 120 characters or fewer.'),
  kind: z.enum(pestKinds, { error: 'Choose insect, disease or weed.' }),
  countUnit: oneLineNameSchema('Enter the count unit, for example "aphids per plant".', 120, 'Keep the count unit to 120 characters or fewer.'),
  actionThreshold: z.coerce
    .number({ error: 'Enter the action threshold as a number.' })
    .min(0, { error: 'The action threshold cannot be negative.' })
    .max(1_000_000),
  thresholdBasis: z.enum(thresholdBases),
  thresholdNote: z.string().trim().max(1000),
  thresholdSource: z
    .string({ error: 'Say where the threshold comes from.' })
    .trim()
    .min(3, { error: 'Say where the threshold comes from (publication, extension service, year).' })
    .max(500),
  active: z.boolean(),
  /** Days a field may go unscouted for this pest before it is due another walk. */
  rescoutDays: z.coerce
    .number({ error: 'Enter the re-scout interval in days.' })
    .int({ error: 'Enter the re-scout interval as whole days.' })
    .min(1, { error: 'The re-scout interval is at least 1 day.' })
    .max(365, { error: 'The re-scout interval is at most 365 days.' }),
  rescoutSource: z.string().trim().min(3, { error: 'Say where the re-scout interval comes from.' }).max(500),
  /** True once someone has checked the interval against its published source. */
  rescoutConfirmed: z.boolean(),
  /** The crops the pest belongs to, as a field names its crop; matched without regard to case. */
  crops: z
    .array(oneLineNameSchema('A crop name cannot be empty.', 80, 'Keep each crop name to 80 characters or fewer.'), {
      error: 'List the crops as names, for example ["soybean", "corn"].',
    })
    .max(40, { error: 'List at most 40 crops for one pest.' })
    .transform(distinctCrops),
  /** True once the admin has checked the threshold against its published source; editing the value or source clears it. */
  thresholdConfirmed: z.boolean({ error: 'Say whether the threshold is confirmed (true or false).' }),
};

/** The crops once each, the first spelling kept when two differ only in case. */
function distinctCrops(crops: string[]) {
  const seen = new Set<string>();
  return crops.filter((crop) => {
    const key = crop.toLocaleLowerCase('en');
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

const commonPracticeRescout = 'Weekly scouting, common practice; confirm for your region';

export const pestSchema = z.object({
  ...pestFields,
  thresholdBasis: pestFields.thresholdBasis.default('mean'),
  thresholdNote: pestFields.thresholdNote.default(''),
  active: pestFields.active.default(true),
  rescoutDays: pestFields.rescoutDays.default(7),
  rescoutSource: pestFields.rescoutSource.default(commonPracticeRescout),
  rescoutConfirmed: pestFields.rescoutConfirmed.default(false),
  crops: pestFields.crops.default([]),
  thresholdConfirmed: pestFields.thresholdConfirmed.default(false),
});
export type PestInput = z.infer<typeof pestSchema>;
// No defaults here: a partial update must not reset what it does not mention.
export const pestUpdateSchema = z
  .object(pestFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, { error: 'Change at least one detail of the pest.' });

/** A library entry as the API answers it. */
export const pestViewSchema = z.object({ id: z.uuid(), ...pestFields });
export type PestView = z.infer<typeof pestViewSchema>;
export interface PestResponse {
  pest: PestView;
}
export interface PestListResponse {
  pests: PestView[];
}
