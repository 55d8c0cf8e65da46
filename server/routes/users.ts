import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { inviteUserSchema, updateUserSchema } from '../../shared/schemas/users.ts';
import { inviteUser, listUsers, resendInvitation, updateUser } from '../services/users.ts';

export const usersRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That user id is not valid.' }) });

usersRouter.get('/', requireRole('admin', 'adviser'), async (req, res) => {
  res.json({ users: await listUsers(actor(req)) });
});

usersRouter.post('/', requireRole('admin'), async (req, res) => {
  // 202 and one sentence whether or not a pending user was made: the answer must not say an address is taken elsewhere.
  res.status(202).json(await inviteUser(actor(req), parse(inviteUserSchema, req.body)));
});

usersRouter.patch('/:id', requireRole('admin'), async (req, res) => {
  const { id } = parse(idParam, req.params);
  res.json({ user: await updateUser(actor(req), id, parse(updateUserSchema, req.body)) });
});

usersRouter.post('/:id/invitation', requireRole('admin'), async (req, res) => {
  const { id } = parse(idParam, req.params);
  res.json({ user: await resendInvitation(actor(req), id) });
});
