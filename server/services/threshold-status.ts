// Threshold status per walk and pest: reads the stops, hands them to the shared statistics module.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { findVisibleField } from './fields.ts';
import { thresholdStatus } from '../../shared/thresholds/threshold-status.ts';
import type { ThresholdBasis } from '../../shared/schemas/pests.ts';
import type { WalkThresholdStatus } from '../../shared/schemas/checks.ts';
import { liveSighting } from './live-sightings.ts';

interface StopRow {
  walkId: string;
  walkedOn: string;
  pestId: string;
  pestName: string;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdSource: string;
  counts: Array<number | null>;
}

/** Stops per walk and pest for a field (placed, not deleted; empty stops are count 0), newest walk first. */
export async function stopsByWalkAndPest(fieldId: string, filter: { pestId?: string; walkId?: string } = {}): Promise<StopRow[]> {
  return sequelize.query<StopRow>(
    `SELECT w.id AS "walkId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn", p.id AS "pestId", p.name AS "pestName",
            p.count_unit AS "countUnit", p.action_threshold AS "actionThreshold", p.threshold_basis AS "thresholdBasis",
            p.threshold_source AS "thresholdSource", array_agg(s.count ORDER BY s.id) AS counts
       FROM sightings s JOIN walks w ON w.id = s.walk_id JOIN pests p ON p.id = s.pest_id
      WHERE s.field_id = :fieldId AND ${liveSighting('s')}
        AND (CAST(:pestId AS uuid) IS NULL OR s.pest_id = CAST(:pestId AS uuid))
        AND (CAST(:walkId AS uuid) IS NULL OR s.walk_id = CAST(:walkId AS uuid))
      GROUP BY w.id, w.walked_on, p.id
      ORDER BY w.walked_on DESC, w.id, p.name`,
    { replacements: { fieldId, pestId: filter.pestId ?? null, walkId: filter.walkId ?? null }, type: QueryTypes.SELECT },
  );
}

export async function fieldThresholdStatus(actor: Actor, fieldId: string, filter: { pestId?: string; walkId?: string }): Promise<WalkThresholdStatus[]> {
  await findVisibleField(actor, fieldId);
  const rows = await stopsByWalkAndPest(fieldId, filter);
  return rows.map((row) => ({
    walkId: row.walkId,
    walkedOn: row.walkedOn,
    pestId: row.pestId,
    pestName: row.pestName,
    countUnit: row.countUnit,
    ...thresholdStatus(row.counts, {
      actionThreshold: row.actionThreshold,
      thresholdBasis: row.thresholdBasis,
      thresholdSource: row.thresholdSource,
      countUnit: row.countUnit,
    }),
  }));
}
