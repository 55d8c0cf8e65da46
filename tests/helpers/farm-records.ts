// Farms, fields and pests made through the API as an admin, so tests start from real rows.
import crypto from 'node:crypto';
import type { Polygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import type { Client } from './http.ts';
import { plainField } from './boundary-shapes.ts';

export const uniqueName = (label: string) => `${label} ${crypto.randomBytes(3).toString('hex')}`;

export async function createFarm(admin: Client, body: { name?: string; contacts?: Array<{ name: string; email: string }> } = {}) {
  const res = await admin.post('/api/farms', { name: body.name ?? uniqueName('Farm'), contacts: body.contacts ?? [] });
  if (res.status !== 201) throw new Error(`farm not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.farm as { id: string; name: string; contacts: Array<{ id: string; name: string; email: string }> };
}

export async function createField(
  admin: Client,
  farmId: string,
  boundary: Polygon | object = plainField(),
  details: { name?: string; crop?: string; season?: number } = {},
) {
  const res = await admin.post('/api/fields', {
    farmId,
    name: details.name ?? uniqueName('Field'),
    crop: details.crop ?? 'soybean',
    season: details.season ?? 2026,
    boundary,
  });
  if (res.status !== 201) throw new Error(`field not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.field as { id: string; farmId: string; name: string; areaM2: number; boundary: object };
}

export async function createPest(admin: Client, overrides: Record<string, unknown> = {}) {
  const res = await admin.post('/api/pests', {
    name: uniqueName('Test aphid'),
    kind: 'insect',
    countUnit: 'aphids per plant',
    actionThreshold: 250,
    thresholdSource: 'Test threshold, not agronomic advice',
    ...overrides,
  });
  if (res.status !== 201) throw new Error(`pest not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.pest as { id: string; name: string } & Record<string, unknown>;
}

/** Rows in fields for one organisation, read straight from the table. */
export async function fieldCount(organisationId: string) {
  const [row] = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM fields WHERE organisation_id = :organisationId', {
    replacements: { organisationId },
    type: QueryTypes.SELECT,
  });
  return row.n;
}

export interface AuditRow {
  user_id: string | null;
  action: string;
  entity: string;
  entity_id: string | null;
  changes: Record<string, unknown>;
}

/** The audit log of one organisation, oldest first. */
export function auditLog(organisationId: string) {
  return sequelize.query<AuditRow>('SELECT user_id, action, entity, entity_id, changes FROM audit_log WHERE organisation_id = :organisationId ORDER BY id', {
    replacements: { organisationId },
    type: QueryTypes.SELECT,
  });
}
