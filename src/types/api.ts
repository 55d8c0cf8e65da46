// Shapes of the API's answers as the client reads them.
import type { MultiPolygon } from 'geojson';
import type { Role } from '@shared/schemas/roles.ts';
import type { PestKind, ThresholdBasis } from '@shared/schemas/pests.ts';

export interface User {
  id: string;
  organisationId: string;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  /** Invited but has not set a password yet. */
  invited: boolean;
}

export interface FarmContact {
  id?: string;
  name: string;
  email: string;
}

export interface Farm {
  id: string;
  name: string;
  contacts: FarmContact[];
  /** Only for admins, only on a single farm. */
  growerUserIds?: string[];
}

export interface Field {
  id: string;
  farmId: string;
  farmName: string;
  name: string;
  crop: string;
  season: number;
  areaM2: number;
  boundary: MultiPolygon;
  scoutIds?: string[];
}

export interface Pest {
  id: string;
  name: string;
  kind: PestKind;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdNote: string;
  thresholdSource: string;
  active: boolean;
}

export interface MailSummary {
  id: number;
  from: string | null;
  to: string[];
  subject: string | null;
  receivedAt: string;
}

export interface MailMessage extends MailSummary {
  text: string;
  html: string | null;
  attachments: Array<{ index: number; filename: string; contentType: string; size: number }>;
}
