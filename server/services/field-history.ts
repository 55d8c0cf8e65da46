// A field's season: its walks with sightings and mean count per walk per pest, and its past checks.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { findVisibleField } from './fields.ts';
import { fieldCheckSummaries } from './checks.ts';
import type { FieldHistoryResponse, HistoryWalk } from '../../shared/schemas/checks.ts';
import { liveSighting } from './live-sightings.ts';

interface WalkPestRow {
  walkId: string;
  walkedOn: string;
  scoutId: string;
  scoutName: string;
  pestId: string | null;
  pestName: string | null;
  sightings: number;
  stops: number;
  meanCount: number | null;
}

export async function fieldHistory(actor: Actor, fieldId: string, pestId?: string): Promise<FieldHistoryResponse> {
  await findVisibleField(actor, fieldId);
  // Walks without any stop for the pest still show, so a visit that found nothing is not lost.
  const rows = await sequelize.query<WalkPestRow>(
    `SELECT w.id AS "walkId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn", u.id AS "scoutId", u.name AS "scoutName",
            p.id AS "pestId", p.name AS "pestName",
            count(s.id) FILTER (WHERE s.count IS NULL OR s.count > 0) AS sightings,
            count(s.id) AS stops,
            avg(s.count) AS "meanCount"
       FROM walks w
       JOIN users u ON u.id = w.scout_id
       LEFT JOIN sightings s ON s.walk_id = w.id AND ${liveSighting('s')}
                             AND (CAST(:pestId AS uuid) IS NULL OR s.pest_id = CAST(:pestId AS uuid))
       LEFT JOIN pests p ON p.id = s.pest_id
      WHERE w.field_id = :fieldId
      GROUP BY w.id, w.walked_on, u.id, p.id
      ORDER BY w.walked_on, w.id, p.name`,
    { replacements: { fieldId, pestId: pestId ?? null }, type: QueryTypes.SELECT },
  );
  const walks = new Map<string, HistoryWalk>();
  for (const row of rows) {
    const walk = walks.get(row.walkId) ?? { walkId: row.walkId, walkedOn: row.walkedOn, scout: { id: row.scoutId, name: row.scoutName }, pests: [] };
    walks.set(row.walkId, walk);
    if (row.pestId) walk.pests.push({ pestId: row.pestId, pestName: row.pestName ?? '', sightings: row.sightings, stops: row.stops, meanCount: row.meanCount });
  }
  return { walks: [...walks.values()], checks: await fieldCheckSummaries(fieldId, pestId) };
}
