// A field's season: its walks with sightings and mean count per walk per pest, and its past checks.
import type { Actor } from '../auth/passport.ts';
import { findVisibleField } from './fields.ts';
import { fieldCheckSummaries } from './checks.ts';
import type { FieldHistoryResponse, HistoryWalk } from '../../shared/schemas/checks.ts';
import { listWalksOfFieldByPest } from '../queries/walks.ts';

export async function fieldHistory(actor: Actor, fieldId: string, pestId?: string): Promise<FieldHistoryResponse> {
  await findVisibleField(actor, fieldId);
  // Walks without any stop for the pest still show, so a visit that found nothing is not lost.
  const rows = await listWalksOfFieldByPest(fieldId, pestId ?? null);
  const walks = new Map<string, HistoryWalk>();
  for (const row of rows) {
    const walk = walks.get(row.walkId) ?? { walkId: row.walkId, walkedOn: row.walkedOn, scout: { id: row.scoutId, name: row.scoutName }, pests: [] };
    walks.set(row.walkId, walk);
    if (row.pestId) walk.pests.push({ pestId: row.pestId, pestName: row.pestName ?? '', sightings: row.sightings, stops: row.stops, meanCount: row.meanCount });
  }
  return { walks: [...walks.values()], checks: await fieldCheckSummaries(actor.organisationId, fieldId, pestId) };
}
