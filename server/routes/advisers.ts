import { Router } from 'express';
import { requireRole, actor } from '../middleware/access.ts';
import { fieldsNeedingAttention } from '../services/attention.ts';

export const advisersRouter = Router();

advisersRouter.get('/attention', requireRole('adviser', 'admin'), async (req, res) => {
  res.json(await fieldsNeedingAttention(actor(req)));
});
