import { Router } from 'express';
import { z } from 'zod';
import { requireRole, requireSignedIn, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { farmSchema } from '../../shared/schemas/farms.ts';
import { assignmentSchema } from '../../shared/schemas/users.ts';
import { createFarm, deleteFarm, getFarm, linkGrower, listFarms, unlinkGrower, updateFarm } from '../services/farms.ts';

export const farmsRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That farm id is not valid.' }) });
const growerParam = idParam.extend({ userId: z.uuid({ error: 'That user id is not valid.' }) });

farmsRouter.get('/', requireSignedIn, async (req, res) => {
  res.json({ farms: await listFarms(actor(req)) });
});

farmsRouter.get('/:id', requireSignedIn, async (req, res) => {
  res.json({ farm: await getFarm(actor(req), parse(idParam, req.params).id) });
});

farmsRouter.post('/', requireRole('admin'), async (req, res) => {
  res.status(201).json({ farm: await createFarm(actor(req), parse(farmSchema, req.body)) });
});

farmsRouter.put('/:id', requireRole('admin'), async (req, res) => {
  res.json({ farm: await updateFarm(actor(req), parse(idParam, req.params).id, parse(farmSchema, req.body)) });
});

farmsRouter.delete('/:id', requireRole('admin'), async (req, res) => {
  await deleteFarm(actor(req), parse(idParam, req.params).id);
  res.status(204).end();
});

farmsRouter.post('/:id/growers', requireRole('admin'), async (req, res) => {
  await linkGrower(actor(req), parse(idParam, req.params).id, parse(assignmentSchema, req.body).userId);
  res.status(204).end();
});

farmsRouter.delete('/:id/growers/:userId', requireRole('admin'), async (req, res) => {
  const { id, userId } = parse(growerParam, req.params);
  await unlinkGrower(actor(req), id, userId);
  res.status(204).end();
});
