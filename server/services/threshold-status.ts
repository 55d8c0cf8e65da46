// Threshold status per walk and pest: reads the stops, hands them to the shared statistics module.
import type { Actor } from '../auth/passport.ts';
import { findVisibleField } from './fields.ts';
import { thresholdStatus } from '../../shared/thresholds/threshold-status.ts';
import type { WalkThresholdStatus } from '../../shared/schemas/checks.ts';
import { liveStopsByWalkAndPest, type StopRow } from '../queries/sightings.ts';

/** Stops per walk and pest for a field (placed, not deleted; empty stops are count 0), newest walk first. */
export async function stopsByWalkAndPest(fieldId: string, filter: { pestId?: string; walkId?: string } = {}): Promise<StopRow[]> {
  return liveStopsByWalkAndPest(fieldId, filter);
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
    thresholdConfirmed: row.thresholdConfirmed,
    ...thresholdStatus(row.counts, {
      actionThreshold: row.actionThreshold,
      thresholdBasis: row.thresholdBasis,
      thresholdSource: row.thresholdSource,
      countUnit: row.countUnit,
    }),
  }));
}
