// The walk API's contract, shared by the server routes and the scout's screens.
import { z } from 'zod';
import { calendarDateSchema } from './calendar-date.ts';

const isoDate = calendarDateSchema({ shape: 'Enter the walk date as YYYY-MM-DD.', notADay: 'That walk date is not a real calendar date.' });

const notes = z.string({ error: 'Notes must be text.' }).max(4000, { error: 'Keep the notes under 4000 characters.' });

export const walkCreateSchema = z.object({
  fieldId: z.uuid({ error: 'Choose the field for this walk.' }),
  walkedOn: isoDate,
  notes: notes.optional(),
});
export type WalkCreateInput = z.infer<typeof walkCreateSchema>;

export const walkUpdateSchema = z
  .object({ notes: notes.optional(), walkedOn: isoDate.optional() })
  .refine((v) => v.notes !== undefined || v.walkedOn !== undefined, { error: 'Change the notes or the walk date.' });
export type WalkUpdateInput = z.infer<typeof walkUpdateSchema>;

export const walkListQuerySchema = z.object({
  fieldId: z.uuid({ error: 'That field id is not valid.' }).optional(),
});

export const walkStopSchema = z.object({
  pestId: z.uuid({ error: 'Choose the pest you were looking for.' }),
  lon: z.coerce
    .number({ error: 'The stop needs a longitude.' })
    .min(-180, { error: 'Longitude must lie between −180 and 180.' })
    .max(180, { error: 'Longitude must lie between −180 and 180.' }),
  lat: z.coerce
    .number({ error: 'The stop needs a latitude.' })
    .min(-90, { error: 'Latitude must lie between −90 and 90.' })
    .max(90, { error: 'Latitude must lie between −90 and 90.' }),
  accuracyM: z.coerce.number({ error: 'The stop needs the position accuracy in metres.' }).min(0, { error: 'Accuracy cannot be negative.' }).max(100_000),
});
export type WalkStopInput = z.infer<typeof walkStopSchema>;

export interface WalkView {
  id: string;
  fieldId: string;
  fieldName: string;
  scoutId: string;
  scoutName: string;
  /** YYYY-MM-DD */
  walkedOn: string;
  notes: string;
  sightingCount: number;
  stopCount: number;
  createdAt: string;
}

export interface WalkListResponse {
  walks: WalkView[];
}
