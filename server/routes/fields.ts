import { Router } from 'express';
import { z } from 'zod';
import { requireRole, requireSignedIn, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { fieldCreateSchema, fieldUpdateSchema } from '../../shared/schemas/fields.ts';
import { assignmentSchema } from '../../shared/schemas/users.ts';
import { assignScout, createField, deleteField, getField, listFields, unassignScout, updateField } from '../services/fields.ts';

export const fieldsRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That field id is not valid.' }) });
const scoutParam = idParam.extend({ userId: z.uuid({ error: 'That user id is not valid.' }) });
const listQuery = z.object({ farmId: z.uuid({ error: 'That farm id is not valid.' }).optional() });

fieldsRouter.get('/', requireSignedIn, async (req, res) => {
  res.json({ fields: await listFields(actor(req), parse(listQuery, req.query)) });
});

fieldsRouter.get('/:id', requireSignedIn, async (req, res) => {
  res.json({ field: await getField(actor(req), parse(idParam, req.params).id) });
});

fieldsRouter.post('/', requireRole('admin'), async (req, res) => {
  res.status(201).json({ field: await createField(actor(req), parse(fieldCreateSchema, req.body)) });
});

fieldsRouter.patch('/:id', requireRole('admin'), async (req, res) => {
  res.json({ field: await updateField(actor(req), parse(idParam, req.params).id, parse(fieldUpdateSchema, req.body)) });
});

fieldsRouter.delete('/:id', requireRole('admin'), async (req, res) => {
  await deleteField(actor(req), parse(idParam, req.params).id);
  res.status(204).end();
});

fieldsRouter.post('/:id/scouts', requireRole('admin'), async (req, res) => {
  await assignScout(actor(req), parse(idParam, req.params).id, parse(assignmentSchema, req.body).userId);
  res.status(204).end();
});

fieldsRouter.delete('/:id/scouts/:userId', requireRole('admin'), async (req, res) => {
  const { id, userId } = parse(scoutParam, req.params);
  await unassignScout(actor(req), id, userId);
  res.status(204).end();
});
