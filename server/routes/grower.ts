import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { listGrowerNotices } from '../services/notice-reading.ts';
import {
  acknowledgeGrowerNotice,
  askGrowerQuestion,
  growerNoticeMachineFile,
  growerNoticeMap,
  growerNoticePage,
  openGrowerNotice,
} from '../services/grower-notices.ts';
import { noticeQuestionSchema } from '../../shared/schemas/notice-questions.ts';
import { sendMachineFile } from './machine-file-response.ts';

/** What a signed-in grower sees of the notices: those for their own farms, with their own copy's state. */
export const growerRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That notice id is not valid.' }) });

growerRouter.use(requireRole('grower'));

growerRouter.get('/notices', async (req, res) => {
  res.json({ notices: await listGrowerNotices(actor(req)) });
});

growerRouter.get('/notices/:id', async (req, res) => {
  res.json({ notice: await growerNoticePage(actor(req), parse(idParam, req.params).id) });
});

growerRouter.get('/notices/:id/map.png', async (req, res) => {
  res.type('png').send(await growerNoticeMap(actor(req), parse(idParam, req.params).id));
});

growerRouter.get('/notices/:id/zones.taskdata.zip', async (req, res) => {
  sendMachineFile(res, await growerNoticeMachineFile(actor(req), parse(idParam, req.params).id, 'taskdata'));
});

growerRouter.get('/notices/:id/zones.shp.zip', async (req, res) => {
  sendMachineFile(res, await growerNoticeMachineFile(actor(req), parse(idParam, req.params).id, 'shapefile'));
});

growerRouter.post('/notices/:id/acknowledge', async (req, res) => {
  res.json(await acknowledgeGrowerNotice(actor(req), parse(idParam, req.params).id));
});

growerRouter.post('/notices/:id/opened', async (req, res) => {
  res.json(await openGrowerNotice(actor(req), parse(idParam, req.params).id));
});

growerRouter.post('/notices/:id/questions', async (req, res) => {
  const { id } = parse(idParam, req.params);
  const { text } = parse(noticeQuestionSchema, req.body);
  res.status(201).json(await askGrowerQuestion(actor(req), id, text));
});
