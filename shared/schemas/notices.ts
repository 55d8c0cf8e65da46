// The zone-notice API's contract: requests (zod) and the answers' types, for the adviser, grower and notice page.
import { z } from 'zod';
import { calendarDateSchema } from './calendar-date.ts';
import type { FeatureCollection, MultiPolygon, Position } from 'geojson';
import type { NoticeQuestionView } from './notice-questions.ts';
import type { VerdictWords } from '../notices/verdict-words.ts';

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
