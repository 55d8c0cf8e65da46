import { Router } from 'express';
import { z } from 'zod';
import { requireSignedIn, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { sightingListQuerySchema, sightingUpdateSchema } from '../../shared/schemas/sightings.ts';
import { deleteSighting, getSighting, listSightings, restoreSighting, updateSighting } from '../services/sightings.ts';

export const sightingsRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That sighting id is not valid.' }) });

sightingsRouter.get('/', requireSignedIn, async (req, res) => {
  res.json(await listSightings(actor(req), parse(sightingListQuerySchema, req.query)));
});

sightingsRouter.get('/:id', requireSignedIn, async (req, res) => {
  res.json({ sighting: await getSighting(actor(req), parse(idParam, req.params).id) });
});

sightingsRouter.patch('/:id', requireSignedIn, async (req, res) => {
  res.json({ sighting: await updateSighting(actor(req), parse(idParam, req.params).id, parse(sightingUpdateSchema, req.body)) });
});

sightingsRouter.delete('/:id', requireSignedIn, async (req, res) => {
  await deleteSighting(actor(req), parse(idParam, req.params).id);
  res.status(204).end();
});

sightingsRouter.post('/:id/restore', requireSignedIn, async (req, res) => {
  res.json({ sighting: await restoreSighting(actor(req), parse(idParam, req.params).id) });
});
