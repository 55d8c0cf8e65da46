import { z } from 'zod';
import { oneLineNameSchema } from './one-line-name.ts';

export const fieldDetailsSchema = z.object({
  farmId: z.uuid({ error: 'Choose the farm this field belongs to.' }),
  name: oneLineNameSchema('Enter the field name.', 120, 'Keep the field name to 120 characters or fewer.'),
  crop: oneLineNameSchema('Enter the crop, for example "soybean".', 80, 'Keep the crop to 80 characters or fewer.'),
  season: z.coerce
    .number({ error: 'Enter the season as a year.' })
    .int({ error: 'Enter the season as a year, like 2026.' })
    .min(1990, { error: 'Enter a season from 1990 on.' })
    .max(2200, { error: 'Enter a season before 2200.' }),
});

/** A field as the admin sends it: details plus the boundary, either as GeoJSON or as the text of a file. */
export const fieldCreateSchema = fieldDetailsSchema.extend({
  boundary: z.unknown().optional(),
  boundaryFile: z.string().max(5_000_000, { error: 'The boundary file is larger than 5 MB; simplify it and upload again.' }).optional(),
});
export const fieldUpdateSchema = fieldCreateSchema.partial().omit({ farmId: true });
export type FieldCreateInput = z.infer<typeof fieldCreateSchema>;

// RFC 7946 MultiPolygon: rings of [lon, lat] positions.
const multiPolygonSchema = z.object({
  type: z.literal('MultiPolygon'),
  coordinates: z.array(z.array(z.array(z.array(z.number())))),
});

/** A field as the API answers it; `scoutIds` only for admins and advisers. */
export const fieldAnswerSchema = z.object({
  id: z.uuid(),
  farmId: z.uuid(),
  farmName: z.string(),
  name: z.string(),
  crop: z.string(),
  season: z.number().int(),
  areaM2: z.number(),
  boundary: multiPolygonSchema,
  scoutIds: z.array(z.uuid()).optional(),
});
export type FieldAnswer = z.infer<typeof fieldAnswerSchema>;
export interface FieldResponse {
  field: FieldAnswer;
}
export interface FieldListResponse {
  fields: FieldAnswer[];
}
