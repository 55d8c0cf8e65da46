// The zone-notice API's contract: requests (zod) and the answers' types, for the adviser, grower and notice page.
import { z } from 'zod';
import { calendarDateSchema } from './calendar-date.ts';
import { emailSchema } from './auth.ts';
import { oneLineNameSchema } from './one-line-name.ts';
import type { FeatureCollection, MultiPolygon, Position } from 'geojson';
import type { NoticeQuestionView } from './notice-questions.ts';
import type { VerdictWords } from '../notices/verdict-words.ts';
import type { DateFormat } from '../dates/format-dates.ts';

export const noticeStatuses = ['draft', 'sending', 'sent', 'partly-failed'] as const;
export type NoticeStatus = (typeof noticeStatuses)[number];
export const deliveryStatuses = ['queued', 'sending', 'sent', 'failed'] as const;
export type DeliveryStatus = (typeof deliveryStatuses)[number];
/** What the adviser sees per recipient: delivery first, then the grower's reading. */
export type RecipientState = DeliveryStatus | 'opened' | 'acknowledged';

const isoDate = calendarDateSchema({ shape: 'Enter the re-scout date as YYYY-MM-DD.', notADay: 'The re-scout date is not a real calendar date.' });

export const noticeCreateSchema = z
  .object({
    fieldId: z.uuid({ error: 'Choose the field for this notice.' }),
    zoneSetId: z.uuid({ error: 'Choose the accepted zones for this notice.' }),
    checkId: z.uuid({ error: 'That check id is not valid.' }).optional(),
    recommendation: z
      .string({ error: 'Write the recommendation: what to do, where and when to re-scout.' })
      .trim()
      .min(10, 'Write the recommendation in at least a sentence: what to do, where and when to re-scout.')
      .max(5000, 'The recommendation can have at most 5,000 characters.'),
    rescoutOn: isoDate.optional(),
  })
  .strict();
export type NoticeCreateRequest = z.output<typeof noticeCreateSchema>;

export interface RecipientView {
  id: string;
  name: string;
  email: string;
  state: RecipientState;
  delivery: DeliveryStatus;
  attempts: number;
  lastError: string | null;
  smtpAcceptedAt: string | null;
  openedAt: string | null;
  acknowledgedAt: string | null;
  revokedAt: string | null;
  linkExpiresAt: string | null;
  /** An address the adviser added for this notice only, not one of the farm's contacts. */
  addedForNotice: boolean;
}

export interface NoticeView {
  id: string;
  fieldId: string;
  fieldName: string;
  farmId: string;
  farmName: string;
  pestId: string;
  pestName: string;
  zoneSetId: string;
  zoneSetVersion: number;
  checkId: string | null;
  recommendation: string;
  rescoutOn: string | null;
  status: NoticeStatus;
  createdBy: { id: string; name: string };
  createdAt: string;
  sentAt: string | null;
  recipients: RecipientView[];
}
export interface NoticeResponse {
  notice: NoticeView;
}
export interface NoticePreviewResponse {
  subject: string;
  html: string;
  text: string;
  /** The map image that the e-mail carries inline (cid:notice-map); the HTML refers to it by cid. */
  mapPath: string;
}

/** How to find a zone in the field: its centre, and how far and which way it lies from the nearest field corner. */
export interface ZoneLocation {
  centre: { lat: number; lon: number };
  nearestCorner: { lat: number; lon: number };
  distanceM: number;
  /** Degrees clockwise from true north, from the corner towards the centre. */
  bearingDeg: number;
  direction: 'N' | 'NE' | 'E' | 'SE' | 'S' | 'SW' | 'W' | 'NW';
}

export interface NoticeZoneRow {
  /** Absent in notices sent before zone locations were kept. */
  location?: ZoneLocation;
  label: string;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightingsInside: number;
  /** Mean count per counted sighting inside the zone (empty stops included); absent in notices sent before it was kept. */
  meanCount?: number | null;
  /** How many sightings with a count lie inside the zone. */
  counted?: number;
}

/** The pest's action threshold the zone counts are read against, with its source. */
export interface NoticeThreshold {
  value: number;
  unit: string;
  source: string;
  /** False while the admin has not checked the threshold against its source; absent in notices sent before it was kept. */
  confirmed?: boolean;
}

/** Everything the notice page (/n/:token) and the e-mail show, built once on the server. */
export interface NoticeContent {
  farmName: string;
  fieldName: string;
  fieldAreaM2: number;
  pestName: string;
  /** YYYY-MM-DD, oldest first. */
  walkDates: string[];
  verdict: VerdictWords;
  /** Absent in notices sent before it was kept. */
  threshold?: NoticeThreshold;
  zones: NoticeZoneRow[];
  totalTreatedM2: number;
  untreatedShare: number;
  recommendation: string;
  rescoutOn: string | null;
  adviserName: string;
  organisationName: string;
  cautions: readonly string[];
  /** The organisation's locale and time zone when the notice was written; absent in notices sent before it was kept (the default then). */
  dateFormat?: DateFormat;
}

/** What a notice shows, as stored with it when it is sent (the snapshot) or gathered live for a draft. */
export interface NoticeMaterial {
  content: NoticeContent;
  boundary: MultiPolygon;
  /** RFC 7946 FeatureCollection; each feature's properties hold its zone-table row. */
  zonesGeoJson: FeatureCollection<MultiPolygon, NoticeZoneRow>;
  /** [longitude, latitude] of each sighting with the pest found, for the map. */
  sightings: Position[];
  zones: Array<{ label: string; geometry: MultiPolygon }>;
}

export interface NoticeLinkResponse {
  notice: NoticeContent & {
    sentAt: string | null;
    recipientName: string;
    acknowledgedAt: string | null;
    /** RFC 7946 FeatureCollection; each feature's properties hold its zone-table row. */
    zonesGeoJson: FeatureCollection<MultiPolygon, NoticeZoneRow>;
    boundary: MultiPolygon;
    /** [longitude, latitude] of each sighting with the pest found, for the map. */
    sightings: Position[];
    mapPath: string;
    /** Sprayer-ready files of the zones: ISO 11783-10 task data and a shapefile, each zipped. */
    zoneFiles: { taskData: string; shapefile: string };
    /** The questions this reader asked on the notice, with the adviser's answers. */
    questions: NoticeQuestionView[];
  };
}
/** The page's report that it was opened: the copy's first opening (null when the reader holds no copy). */
export interface OpenedResponse {
  openedAt: string | null;
  alreadyOpened: boolean;
}
export interface AcknowledgeResponse {
  acknowledgedAt: string;
  alreadyAcknowledged: boolean;
}

export interface GrowerNoticeSummary {
  id: string;
  farmName: string;
  fieldName: string;
  pestName: string;
  sentAt: string | null;
  status: NoticeStatus;
  zoneCount: number;
  totalTreatedM2: number;
  /** This grower's own copy, when the grower is one of the farm's contacts (matched by e-mail). */
  myCopy: { state: RecipientState; openedAt: string | null; acknowledgedAt: string | null } | null;
}
export interface GrowerNoticesResponse {
  notices: GrowerNoticeSummary[];
}

export interface UnacknowledgedNotice {
  noticeId: string;
  fieldId: string;
  fieldName: string;
  farmName: string;
  pestName: string;
  sentAt: string;
  daysSinceSent: number;
  recipientsWaiting: number;
  message: string;
}

// --- Choosing who gets a notice (the send request) ---

/** At most this many copies of one notice: a farm's 20 contacts and a few addresses added for one notice. */
export const MAX_NOTICE_RECIPIENTS = 30;

export const addedRecipientSchema = z
  .object({
    name: oneLineNameSchema('Enter the name of the person to add.', 120, 'Keep the name to 120 characters or fewer.'),
    email: emailSchema,
  })
  .strict();

/**
 * Who gets this one notice: the farm's contacts kept (by id; the rest are left out) and addresses added for this
 * notice only. Without a body, every contact of the farm gets a copy.
 */
export const noticeRecipientChoiceSchema = z
  .object({
    contactIds: z.array(z.uuid({ error: 'That contact id is not valid.' })).max(MAX_NOTICE_RECIPIENTS),
    added: z.array(addedRecipientSchema).max(10, { error: 'Add at most 10 addresses to one notice.' }).default([]),
  })
  .strict()
  .refine((choice) => choice.contactIds.length + choice.added.length > 0, {
    error: 'Choose at least one recipient: keep a contact of the farm or add an address.',
    path: ['contactIds'],
  })
  .refine((choice) => new Set(choice.added.map((a) => a.email)).size === choice.added.length, {
    error: 'Each added address can be given once.',
    path: ['added'],
  });
export type NoticeRecipientChoice = z.output<typeof noticeRecipientChoiceSchema>;

export const noticeSendSchema = z.object({ recipients: noticeRecipientChoiceSchema.optional() }).strict();
export type NoticeSendRequest = z.output<typeof noticeSendSchema>;

// --- The adviser's list of every notice (filters and pages) ---

/** What the list can be narrowed to: notices with at least one live copy in that state (or drafts). */
export const noticeListStates = ['draft', 'not-acknowledged', 'acknowledged', 'opened', 'accepted', 'on-its-way', 'failed'] as const;
export type NoticeListState = (typeof noticeListStates)[number];

export const NOTICE_PAGE_DEFAULT = 25;
/** The most notices one page may ask for. */
export const NOTICE_PAGE_MAX = 100;

const instant = (what: string) => z.iso.datetime({ offset: true, error: `Give ${what} as a date and time with its offset, like 2026-07-01T00:00:00+02:00.` });

export const noticeListQuerySchema = z
  .object({
    farmId: z.uuid({ error: 'That farm id is not valid.' }).optional(),
    fieldId: z.uuid({ error: 'That field id is not valid.' }).optional(),
    state: z.enum(noticeListStates, { error: `Choose a state among: ${noticeListStates.join(', ')}.` }).optional(),
    /** The notice's date (sent, or written for a draft) on or after this instant. */
    from: instant('the start of the date range').optional(),
    /** …and before this instant. */
    before: instant('the end of the date range').optional(),
    limit: z.coerce
      .number({ error: 'The page size must be a number.' })
      .int({ error: 'The page size must be a whole number.' })
      .min(1, { error: 'Ask for at least one notice per page.' })
      .max(NOTICE_PAGE_MAX, { error: `Ask for at most ${NOTICE_PAGE_MAX} notices per page.` })
      .default(NOTICE_PAGE_DEFAULT),
    cursor: z.string().max(200, { error: 'That page cursor is not valid; start again from the first page.' }).optional(),
  })
  .strict()
  .refine((q) => !q.from || !q.before || Date.parse(q.from) < Date.parse(q.before), {
    error: 'The end of the date range must come after its start.',
    path: ['before'],
  });
export type NoticeListQuery = z.output<typeof noticeListQuerySchema>;

export interface NoticeListEntry {
  id: string;
  fieldId: string;
  fieldName: string;
  farmId: string;
  farmName: string;
  pestName: string;
  zoneSetVersion: number;
  status: NoticeStatus;
  createdAt: string;
  sentAt: string | null;
  recipients: RecipientView[];
}
export interface NoticeListPage {
  notices: NoticeListEntry[];
  /** Pass back as `cursor` for the next page; null on the last one. */
  nextCursor: string | null;
  limit: number;
}
