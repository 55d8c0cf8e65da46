// A field's pattern checks, threshold status and season history (mounted beside the fields router).
import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { fieldChecksQuerySchema, fieldHistoryQuerySchema, thresholdStatusQuerySchema } from '../../shared/schemas/checks.ts';
import { listFieldChecks } from '../services/checks.ts';
import { fieldThresholdStatus } from '../services/threshold-status.ts';
import { fieldHistory } from '../services/field-history.ts';

export const fieldInsightsRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That field id is not valid.' }) });

fieldInsightsRouter.get('/:id/checks', requireRole('adviser', 'admin'), async (req, res) => {
  res.json(await listFieldChecks(actor(req), parse(idParam, req.params).id, parse(fieldChecksQuerySchema, req.query)));
});

fieldInsightsRouter.get('/:id/threshold-status', requireRole('adviser', 'admin'), async (req, res) => {
  res.json({ statuses: await fieldThresholdStatus(actor(req), parse(idParam, req.params).id, parse(thresholdStatusQuerySchema, req.query)) });
});

fieldInsightsRouter.get('/:id/history', requireRole('adviser', 'admin'), async (req, res) => {
  const { pestId } = parse(fieldHistoryQuerySchema, req.query);
  res.json(await fieldHistory(actor(req), parse(idParam, req.params).id, pestId));
});
