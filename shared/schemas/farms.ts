import { z } from 'zod';
import { oneLineNameSchema } from './one-line-name.ts';
import { emailSchema } from './auth.ts';
import { personNameSchema } from './users.ts';

export const farmContactSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
});

export const farmSchema = z.object({
  name: oneLineNameSchema('Enter the farm name.', 120, 'Keep the farm name to 120 characters or fewer.'),
  contacts: z
    .array(farmContactSchema)
    .max(20, { error: 'A farm can have at most 20 grower contacts.' })
    .refine((list) => new Set(list.map((c) => c.email)).size === list.length, {
      error: 'Each grower contact needs a different e-mail address.',
    })
    .default([]),
});
export type FarmInput = z.infer<typeof farmSchema>;

/** A farm as the API answers it; `growerUserIds` only for admins, only on a single farm. */
export const farmViewSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  contacts: z.array(farmContactSchema.extend({ id: z.uuid().optional() })),
  growerUserIds: z.array(z.uuid()).optional(),
});
export type FarmView = z.infer<typeof farmViewSchema>;
export type FarmContactView = FarmView['contacts'][number];
export interface FarmResponse {
  farm: FarmView;
}
export interface FarmListResponse {
  farms: FarmView[];
}
