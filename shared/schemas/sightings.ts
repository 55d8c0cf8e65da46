// The sighting and photo-upload API's contract, shared by the server routes and the scout's screens.
import { z } from 'zod';
import { calendarDateSchema } from './calendar-date.ts';
import type { WalkView } from './walks.ts';
import { pageQueryFields, type PageInfo } from './page.ts';

export const positionSources = ['exif', 'pin', 'device'] as const;
export type PositionSource = (typeof positionSources)[number];
export const sightingStatuses = ['placed', 'needs-pin'] as const;
export type SightingStatus = (typeof sightingStatuses)[number];
export const timeFlags = ['missing', 'future', 'old'] as const;
export type TimeFlag = (typeof timeFlags)[number];
export const thumbnailStatuses = ['pending', 'ready', 'failed'] as const;
export type ThumbnailStatus = (typeof thumbnailStatuses)[number];
/** `rejected` and `outside` are final (nothing about the photo will change that); `retry` kept nothing because of a fault on
 * the server's side (storage or database not answering), so the same photo sent again later may well be placed. */
export const photoOutcomes = ['placed', 'needs-pin', 'outside', 'duplicate', 'rejected', 'retry'] as const;
export type PhotoOutcomeKind = (typeof photoOutcomes)[number];

/** Name of the multipart file part for POST /api/photos. */
export const photoFilePart = 'photos';

export const positionSchema = z.object({
  lon: z
    .number({ error: 'The position needs a longitude.' })
    .min(-180, { error: 'Longitude must lie between −180 and 180.' })
    .max(180, { error: 'Longitude must lie between −180 and 180.' }),
  lat: z
    .number({ error: 'The position needs a latitude.' })
    .min(-90, { error: 'Latitude must lie between −90 and 90.' })
    .max(90, { error: 'Latitude must lie between −90 and 90.' }),
});
export type Position = z.infer<typeof positionSchema>;

const count = z
  .number({ error: 'The count must be a number.' })
  .min(0, { error: 'The count cannot be negative.' })
  .max(1_000_000, { error: 'That count is too large.' });

function jsonArray<T extends z.ZodType>(item: T, message: string) {
  return z
    .string()
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message });
        return z.NEVER;
      }
    })
    .pipe(z.array(item, { error: message }));
}

/** The text fields of the multipart upload (all arrive as strings). */
export const photoUploadFieldsSchema = z.object({
  pestId: z.uuid({ error: 'Choose the pest for these photos.' }),
  count: z
    .string()
    .trim()
    .optional()
    .transform((v) => (v === undefined || v === '' ? undefined : Number(v)))
    .pipe(count.optional()),
  counts: jsonArray(count.nullable(), 'Per-photo counts must be a JSON list of numbers (or null).').optional(),
  walkId: z.uuid({ error: 'That walk id is not valid.' }).optional(),
  fieldId: z.uuid({ error: 'That field id is not valid.' }).optional(),
  clientIds: jsonArray(z.string().max(200), 'clientIds must be a JSON list of strings, one per photo.').optional(),
});
export type PhotoUploadFields = z.infer<typeof photoUploadFieldsSchema>;

export interface NearestField {
  id: string;
  name: string;
  distanceM: number;
}

export interface PhotoOutcome {
  clientId?: string;
  fileName: string;
  outcome: PhotoOutcomeKind;
  /** A sentence for the scout. */
  message: string;
  sightingId?: string;
  photoId?: string;
  walkId?: string;
  fieldId?: string;
  fieldName?: string;
  nearestField?: NearestField;
}

export interface PhotoUploadResponse {
  results: PhotoOutcome[];
}

const isoDate = calendarDateSchema({ shape: 'Dates must be YYYY-MM-DD.', notADay: 'That date is not a real calendar date; pick a day that exists.' });

/** Sightings per page of GET /api/sightings: the review reads every page of a field at the largest size. */
export const SIGHTING_PAGE = { default: 250, max: 1000 };

export const sightingListQuerySchema = z.object({
  fieldId: z.uuid({ error: 'That field id is not valid.' }).optional(),
  pestId: z.uuid({ error: 'That pest id is not valid.' }).optional(),
  walkId: z.uuid({ error: 'That walk id is not valid.' }).optional(),
  scoutId: z.uuid({ error: 'That scout id is not valid.' }).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  status: z.enum(sightingStatuses, { error: 'Status must be placed or needs-pin.' }).optional(),
  ...pageQueryFields('sightings', SIGHTING_PAGE),
});
export type SightingListQuery = z.infer<typeof sightingListQuerySchema>;
/** The filters of a list of sightings, without its page. */
export type SightingFilter = Omit<SightingListQuery, 'limit' | 'cursor'>;

export const sightingUpdateSchema = z
  .object({
    pestId: z.uuid({ error: 'Choose a pest from the library.' }).optional(),
    count: count.nullable().optional(),
    position: positionSchema.optional(),
  })
  .refine((v) => v.pestId !== undefined || v.count !== undefined || v.position !== undefined, {
    error: 'Change the pest, the count or the position.',
  });
export type SightingUpdateInput = z.infer<typeof sightingUpdateSchema>;

export interface SightingView {
  id: string;
  fieldId: string;
  walkId: string;
  /** YYYY-MM-DD */
  walkedOn: string;
  pestId: string;
  pestName: string;
  count: number | null;
  position: Position | null;
  positionSource: PositionSource;
  accuracyM: number | null;
  altitudeM: number | null;
  directionDeg: number | null;
  observedAt: string | null;
  timeFlag: TimeFlag | null;
  status: SightingStatus;
  photoId: string | null;
  thumbnailStatus: ThumbnailStatus | null;
  scoutId: string;
  scoutName: string;
  isEmptyStop: boolean;
  createdAt: string;
}

export interface SightingListResponse extends PageInfo {
  sightings: SightingView[];
}

export interface WalkDetailResponse {
  walk: WalkView;
  sightings: SightingView[];
  /** Sightings of the walk removed in the last SIGHTING_RECOVERABLE_DAYS that the caller may restore, latest first. */
  removed: SightingView[];
}

/** A removed sighting (and its photo) can be restored this many days; the purge job removes older ones. */
export const SIGHTING_RECOVERABLE_DAYS = 30;
