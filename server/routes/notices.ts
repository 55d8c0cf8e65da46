import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { noticeCreateSchema, noticeListQuerySchema, noticeSendSchema } from '../../shared/schemas/notices.ts';
import { createNotice } from '../services/notice-drafts.ts';
import { getNotice, listNotices } from '../services/notice-reading.ts';
import { listNoticeOverview } from '../services/notice-list.ts';
import { noticeMaterial } from '../services/notice-material.ts';
import { revokeRecipient, sendNotice } from '../services/notice-sending.ts';
import { answerQuestion, listNoticeQuestions } from '../services/notice-questions.ts';
import { noticeAnswerSchema } from '../../shared/schemas/notice-questions.ts';
import { composeNoticeMail, PREVIEW_LINK } from '../services/notice-mail.ts';
import { renderNoticeMap } from '../services/notice-map.ts';

/** The adviser's zone notices: draft, preview, send, follow each copy, withdraw a link. */
export const noticesRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That notice id is not valid.' }) });
const recipientParam = idParam.extend({ rid: z.uuid({ error: 'That recipient id is not valid.' }) });
const questionParam = idParam.extend({ qid: z.uuid({ error: 'That question id is not valid.' }) });
const listQuery = z.object({ fieldId: z.uuid({ error: 'That field id is not valid.' }).optional() });

noticesRouter.use(requireRole('admin', 'adviser'));

noticesRouter.get('/', async (req, res) => {
  res.json({ notices: await listNotices(actor(req), parse(listQuery, req.query)) });
});

// Every notice of the organisation with each copy's state, filtered and paged (declared before '/:id').
noticesRouter.get('/overview', async (req, res) => {
  res.json(await listNoticeOverview(actor(req), parse(noticeListQuerySchema, req.query)));
});

noticesRouter.post('/', async (req, res) => {
  res.status(201).json({ notice: await createNotice(actor(req), parse(noticeCreateSchema, req.body)) });
});

noticesRouter.get('/:id', async (req, res) => {
  res.json({ notice: await getNotice(actor(req), parse(idParam, req.params).id) });
});

noticesRouter.get('/:id/preview', async (req, res) => {
  const notice = await getNotice(actor(req), parse(idParam, req.params).id);
  const { subject, html, text } = composeNoticeMail(await noticeMaterial(notice.id), PREVIEW_LINK);
  res.json({ subject, html, text, mapPath: `/api/notices/${notice.id}/map.png` });
});

noticesRouter.get('/:id/map.png', async (req, res) => {
  const notice = await getNotice(actor(req), parse(idParam, req.params).id);
  const material = await noticeMaterial(notice.id);
  res.type('png').send(renderNoticeMap({ boundary: material.boundary, zones: material.zones, sightings: material.sightings }));
});

noticesRouter.post('/:id/send', async (req, res) => {
  const { id } = parse(idParam, req.params);
  res.status(202).json({ notice: await sendNotice(actor(req), id, parse(noticeSendSchema, req.body ?? {}).recipients) });
});

noticesRouter.post('/:id/recipients/:rid/revoke', async (req, res) => {
  const { id, rid } = parse(recipientParam, req.params);
  res.json({ notice: await revokeRecipient(actor(req), id, rid) });
});

noticesRouter.get('/:id/questions', async (req, res) => {
  res.json({ questions: await listNoticeQuestions(actor(req), parse(idParam, req.params).id) });
});

noticesRouter.post('/:id/questions/:qid/answer', async (req, res) => {
  const { id, qid } = parse(questionParam, req.params);
  res.json(await answerQuestion(actor(req), id, qid, parse(noticeAnswerSchema, req.body).text));
});
