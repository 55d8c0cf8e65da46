import { z } from 'zod';

export const fieldDetailsSchema = z.object({
  farmId: z.uuid({ error: 'Choose the farm this field belongs to.' }),
  name: z.string({ error: 'Enter the field name.' }).trim().min(1, { error: 'Enter the field name.' }).max(120),
  crop: z.string({ error: 'Enter the crop.' }).trim().min(1, { error: 'Enter the crop, for example "soybean".' }).max(80),
  season: z.coerce.number({ error: 'Enter the season as a year.' }).int({ error: 'Enter the season as a year, like 2026.' }).min(1990, { error: 'Enter a season from 1990 on.' }).max(2200, { error: 'Enter a season before 2200.' }),
});

/** A field as the admin sends it: details plus the boundary, either as GeoJSON or as the text of a file. */
export const fieldCreateSchema = fieldDetailsSchema.extend({
  boundary: z.unknown().optional(),
  boundaryFile: z.string().max(5_000_000, { error: 'The boundary file is larger than 5 MB; simplify it and upload again.' }).optional(),
});
export const fieldUpdateSchema = fieldCreateSchema.partial().omit({ farmId: true });
export type FieldCreateInput = z.infer<typeof fieldCreateSchema>;
