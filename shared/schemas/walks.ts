// The walk API's contract, shared by the server routes and the scout's screens.
import { z } from 'zod';
import { calendarDateSchema } from './calendar-date.ts';
import { pageQueryFields, type PageInfo } from './page.ts';

const isoDate = calendarDateSchema({ shape: 'Enter the walk date as YYYY-MM-DD.', notADay: 'That walk date is not a real calendar date.' });

const notes = z.string({ error: 'Notes must be text.' }).max(4000, { error: 'Keep the notes under 4000 characters.' });

export const walkCreateSchema = z.object({
  /**
   * The phone's own id for a walk started without signal, so the photos and stops kept for it can name it before the
   * server has it. Ignored when the scout already has a walk on that field and day: the answer then names that one.
   */
  id: z.uuid({ error: 'The walk id from the phone must be a UUID.' }).optional(),
  fieldId: z.uuid({ error: 'Choose the field for this walk.' }),
  walkedOn: isoDate,
  notes: notes.optional(),
});
export type WalkCreateInput = z.infer<typeof walkCreateSchema>;

export const walkUpdateSchema = z
  .object({ notes: notes.optional(), walkedOn: isoDate.optional() })
  .refine((v) => v.notes !== undefined || v.walkedOn !== undefined, { error: 'Change the notes or the walk date.' });
export type WalkUpdateInput = z.infer<typeof walkUpdateSchema>;

/** Finishing takes no choices: the server's clock records when. */
export const walkFinishSchema = z.strictObject({}, { error: 'Finishing a walk takes no fields; send an empty body.' });

/** Walks per page of GET /api/walks, newest first. */
export const WALK_PAGE = { default: 25, max: 100 };

const listDay = calendarDateSchema({
  shape: 'Give the day of the walks as YYYY-MM-DD.',
  notADay: 'That day is not a real calendar date; pick a day that exists.',
});

/** One field's walks or every visible one, of one day (`walkedOn`) or a window of days (`from`, `to`, either end open). */
export const walkListQuerySchema = z
  .object({
    fieldId: z.uuid({ error: 'That field id is not valid.' }).optional(),
    walkedOn: listDay.optional(),
    from: listDay.optional(),
    to: listDay.optional(),
    ...pageQueryFields('walks', WALK_PAGE),
  })
  .refine((q) => q.walkedOn === undefined || (q.from === undefined && q.to === undefined), {
    error: 'Ask for the walks of one day (walkedOn) or of a window (from, to), not both.',
    path: ['walkedOn'],
  })
  // YYYY-MM-DD compares as text in calendar order.
  .refine((q) => q.from === undefined || q.to === undefined || q.from <= q.to, {
    error: 'The first day of the window comes after its last day.',
    path: ['to'],
  });
export type WalkListQuery = z.infer<typeof walkListQuerySchema>;

/** A phone's clock may run a little ahead of the server's. */
const STOP_CLOCK_SLACK_MS = 10 * 60_000;

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
  /** The phone's own id for the stop, so a stop sent twice (kept offline, a retry) is recorded once. */
  clientId: z.string().trim().min(1).max(100, { error: 'The stop id is at most 100 characters.' }).optional(),
  /** When the stop was recorded on the phone, for a stop sent later; the server's clock when absent. */
  observedAt: z.iso
    .datetime({ offset: true, error: 'The stop time must be an ISO 8601 date and time.' })
    .refine((t) => Date.parse(t) <= Date.now() + STOP_CLOCK_SLACK_MS, { error: 'The stop time lies in the future; check the phone’s clock.' })
    .optional(),
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
  /** When the walk was finished (ISO 8601), null while it is open. A finished walk still takes late photos and stops from a phone. */
  finishedAt: string | null;
}

export interface WalkListResponse extends PageInfo {
  walks: WalkView[];
}

/** A finished walk at a glance: its stops after same-stop merging, the route walked and how evenly the field was searched. */
export interface WalkSummary {
  walkId: string;
  /** Live placed sightings and empty stops of the walk, before merging. */
  sightings: number;
  stops: number;
  found: number;
  empty: number;
  /** Stop to stop in the order they were made (turf `length`). */
  routeLengthM: number;
  /** Null under four stops: too few to judge. */
  coverage: {
    cellSizeM: number;
    visitedShare: number;
    expectedVisitedShare: number;
    stopsR: number | null;
    uneven: boolean;
    warnings: string[];
  } | null;
  /** One plain sentence on how evenly the field was covered. */
  evenness: string;
}

export interface WalkSummaryResponse {
  summary: WalkSummary;
}
