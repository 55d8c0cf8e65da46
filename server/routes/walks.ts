import { Router } from 'express';
import { z } from 'zod';
import { requireRole, requireSignedIn, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { walkCreateSchema, walkFinishSchema, walkListQuerySchema, walkStopSchema, walkUpdateSchema } from '../../shared/schemas/walks.ts';
import { createWalk, finishWalk, getWalk, listWalks, updateWalk } from '../services/walks.ts';
import { recordEmptyStop } from '../services/sightings.ts';
import { walkSummary } from '../services/walk-summary.ts';

export const walksRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That walk id is not valid.' }) });

walksRouter.get('/', requireSignedIn, async (req, res) => {
  res.json(await listWalks(actor(req), parse(walkListQuerySchema, req.query)));
});

walksRouter.post('/', requireSignedIn, async (req, res) => {
  const { walk, created } = await createWalk(actor(req), parse(walkCreateSchema, req.body));
  res.status(created ? 201 : 200).json({ walk });
});

walksRouter.get('/:id', requireSignedIn, async (req, res) => {
  res.json(await getWalk(actor(req), parse(idParam, req.params).id));
});

walksRouter.get('/:id/summary', requireRole('scout', 'adviser', 'admin'), async (req, res) => {
  res.json({ summary: await walkSummary(actor(req), parse(idParam, req.params).id) });
});

walksRouter.post('/:id/finish', requireRole('scout', 'adviser', 'admin'), async (req, res) => {
  const { id } = parse(idParam, req.params);
  parse(walkFinishSchema, req.body ?? {});
  res.json({ walk: await finishWalk(actor(req), id) });
});

walksRouter.patch('/:id', requireSignedIn, async (req, res) => {
  res.json({ walk: await updateWalk(actor(req), parse(idParam, req.params).id, parse(walkUpdateSchema, req.body)) });
});

walksRouter.post('/:id/stops', requireSignedIn, async (req, res) => {
  const { sighting, created } = await recordEmptyStop(actor(req), parse(idParam, req.params).id, parse(walkStopSchema, req.body));
  res.status(created ? 201 : 200).json({ sighting });
});
