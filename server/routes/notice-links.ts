import { Router } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import { z } from 'zod';
import { AppError } from '../errors.ts';
import { acknowledge, linkAsker, linkRefused, mapForLink, markOpened, noticeForLink, resolveNoticeToken } from '../services/notice-links.ts';
import { askQuestion } from '../services/notice-questions.ts';
import { parse } from '../middleware/validate.ts';
import { noticeQuestionSchema } from '../../shared/schemas/notice-questions.ts';
import { noticeMachineFile } from '../services/zone-files/zone-machine-files.ts';
import { sendMachineFile } from './machine-file-response.ts';

/** The grower's notice page, opened by the token in the e-mailed link alone (no sign-in). */
export const noticeLinksRouter = Router();

// Counted per address: enough for a grower reopening the page, too few to guess tokens.
noticeLinksRouter.use(
  rateLimit({
    windowMs: 60 * 1000,
    limit: 120,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many requests for notice pages; wait a minute and try again.')),
  }),
);

const tokenParam = z.object({ token: z.string().max(200) });
const token = (params: unknown) => {
  const result = tokenParam.safeParse(params);
  if (!result.success) throw linkRefused();
  return result.data.token;
};

noticeLinksRouter.get('/:token', async (req, res) => {
  res.json({ notice: await noticeForLink(token(req.params)) });
});

// The page reports that it was opened (not the GET: mail scanners and previews fetch links by themselves).
noticeLinksRouter.post('/:token/opened', async (req, res) => {
  const copy = await resolveNoticeToken(token(req.params));
  const { openedAt, alreadyOpened } = await markOpened(copy.recipientId);
  res.json({ openedAt: openedAt.toISOString(), alreadyOpened });
});

noticeLinksRouter.post('/:token/acknowledge', async (req, res) => {
  const copy = await resolveNoticeToken(token(req.params));
  const { acknowledgedAt, alreadyAcknowledged } = await acknowledge(copy.recipientId);
  res.json({ acknowledgedAt: acknowledgedAt.toISOString(), alreadyAcknowledged });
});

noticeLinksRouter.post('/:token/questions', async (req, res) => {
  const copy = await resolveNoticeToken(token(req.params));
  const { text } = parse(noticeQuestionSchema, req.body);
  res.status(201).json(await askQuestion(copy.noticeId, linkAsker(copy), text));
});

noticeLinksRouter.get('/:token/map.png', async (req, res) => {
  res.type('png').send(await mapForLink(token(req.params)));
});

noticeLinksRouter.get('/:token/zones.taskdata.zip', async (req, res) => {
  sendMachineFile(res, await noticeMachineFile((await resolveNoticeToken(token(req.params))).noticeId, 'taskdata'));
});

noticeLinksRouter.get('/:token/zones.shp.zip', async (req, res) => {
  sendMachineFile(res, await noticeMachineFile((await resolveNoticeToken(token(req.params))).noticeId, 'shapefile'));
});
