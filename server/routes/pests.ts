import { Router } from 'express';
import { z } from 'zod';
import { requireRole, requireSignedIn, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { pestSchema, pestUpdateSchema } from '../../shared/schemas/pests.ts';
import { createPest, listPests, updatePest } from '../services/pests.ts';

export const pestsRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That pest id is not valid.' }) });
const listQuery = z.object({ includeInactive: z.enum(['true', 'false'], { error: 'Set includeInactive to true or false.' }).optional() });

pestsRouter.get('/', requireSignedIn, async (req, res) => {
  const { includeInactive } = parse(listQuery, req.query);
  res.json({ pests: await listPests(actor(req), { includeInactive: includeInactive === 'true' }) });
});

pestsRouter.post('/', requireRole('admin'), async (req, res) => {
  res.status(201).json({ pest: await createPest(actor(req), parse(pestSchema, req.body)) });
});

pestsRouter.patch('/:id', requireRole('admin'), async (req, res) => {
  res.json({ pest: await updatePest(actor(req), parse(idParam, req.params).id, parse(pestUpdateSchema, req.body)) });
});
