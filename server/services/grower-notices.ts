// A signed-in grower's own zone notices: those sent about farms linked to their account (farm_growers), opened
// without the e-mailed token. Their own copy is the notice_recipients row that carries their e-mail address.
import type { Actor } from '../auth/passport.ts';
import { AppError, notFound } from '../errors.ts';
import { findCopyForEmail, type NoticeRecipientRow } from '../queries/notice-recipients.ts';
import { findSentNoticeOfGrower } from '../queries/notices.ts';
import { acknowledge, markOpened, noticeMapImage, noticePageContent } from './notice-links.ts';
import { noticeMachineFile, type MachineFileKind } from './zone-files/zone-machine-files.ts';
import { askQuestion, type Asker } from './notice-questions.ts';
import type { AcknowledgeResponse, NoticeLinkResponse, OpenedResponse } from '../../shared/schemas/notices.ts';

/** The sent notice, when it is about a farm linked to this grower; any other id (another farm, another organisation, a draft) is not found. */
export async function findGrowerNotice(actor: Actor, noticeId: string) {
  const id = await findSentNoticeOfGrower(actor.organisationId, actor.id, noticeId);
  if (!id) throw notFound('That notice');
  const copy = (await findCopyForEmail(id, actor.email.toLowerCase())) ?? null;
  return { noticeId: id, copy };
}

/** The signed-in grower, under their copy's name when they hold one. */
const growerAsker = (actor: Actor, copy: NoticeRecipientRow | null): Asker => ({
  name: copy?.contactName ?? actor.name,
  email: actor.email,
  recipientId: copy?.id ?? null,
  userId: actor.id,
});

/** The grower's question or comment on a notice of their own farm, e-mailed to its adviser. */
export async function askGrowerQuestion(actor: Actor, noticeId: string, text: string) {
  const { copy } = await findGrowerNotice(actor, noticeId);
  return askQuestion(noticeId, growerAsker(actor, copy), text);
}

/** The notice page's content for the grower; reading it changes nothing (the page reports its opening itself). */
export async function growerNoticePage(actor: Actor, noticeId: string): Promise<NoticeLinkResponse['notice']> {
  const { copy } = await findGrowerNotice(actor, noticeId);
  return noticePageContent(
    noticeId,
    { name: copy?.contactName ?? actor.name, acknowledgedAt: copy?.acknowledgedAt ?? null, asker: growerAsker(actor, copy) },
    `/api/grower/notices/${noticeId}`,
  );
}

export async function growerNoticeMap(actor: Actor, noticeId: string): Promise<Buffer> {
  await findGrowerNotice(actor, noticeId);
  return noticeMapImage(noticeId);
}

/** The sprayer-ready files of a notice of the grower's own farm. */
export async function growerNoticeMachineFile(actor: Actor, noticeId: string, kind: MachineFileKind) {
  await findGrowerNotice(actor, noticeId);
  return noticeMachineFile(noticeId, kind);
}

/** Records that the grower opened their own copy (the first time only); a grower who holds no copy has nothing to record. */
export async function openGrowerNotice(actor: Actor, noticeId: string): Promise<OpenedResponse> {
  const { copy } = await findGrowerNotice(actor, noticeId);
  if (!copy) return { openedAt: null, alreadyOpened: false };
  const { openedAt, alreadyOpened } = await markOpened(copy.id);
  return { openedAt: openedAt.toISOString(), alreadyOpened };
}

/** Acknowledges the grower's own copy (once; a second time answers with the first time). */
export async function acknowledgeGrowerNotice(actor: Actor, noticeId: string): Promise<AcknowledgeResponse> {
  const { copy } = await findGrowerNotice(actor, noticeId);
  if (!copy) {
    throw new AppError(
      409,
      'not_a_recipient',
      `This notice was addressed to the farm's contacts, not to ${actor.email}; one of them acknowledges it from their own copy.`,
    );
  }
  const { acknowledgedAt, alreadyAcknowledged } = await acknowledge(copy.id);
  return { acknowledgedAt: acknowledgedAt.toISOString(), alreadyAcknowledged };
}
