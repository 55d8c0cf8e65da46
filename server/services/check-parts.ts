// The parts of a finished check that grow with its sightings (per-stop figures, quadrat cells, the scouted-area
// polygons, the sightings' ids), each fetched on its own when the page opens the layer or table that shows it.
import { findCheckAnswerVersion, findCheckPartText, type CheckPart } from '../queries/pattern-checks.ts';
import type { Actor } from '../auth/passport.ts';
import { conflict, notFound } from '../errors.ts';
import { cachedAnswer, serialise, type SerialisedAnswer } from './check-answer-cache.ts';

export type { CheckPart };

/** The sightings' ids are stored when the check is asked for; every other part comes with the finished result. */
const readyBeforeDone: ReadonlySet<CheckPart> = new Set(['sighting-ids']);

/** One part of one of the actor's organisation's checks, serialised; a finished check's bytes come from the cache. */
export async function getCheckPart(actor: Actor, checkId: string, part: CheckPart): Promise<SerialisedAnswer> {
  const stored = await findCheckAnswerVersion(actor.organisationId, checkId);
  if (!stored) throw notFound('That pattern check');
  const build = async () => (await findCheckPartText(checkId, part)) ?? 'null';
  if (stored.status === 'done') return cachedAnswer(`${checkId}/${part}`, stored.version, build);
  if (readyBeforeDone.has(part)) return serialise(await build());
  throw conflict('This check has not finished yet; these figures come with its result.');
}
