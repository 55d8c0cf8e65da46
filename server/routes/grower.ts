import { Router } from 'express';
import { requireRole, actor } from '../middleware/access.ts';
import { listGrowerNotices } from '../services/notices.ts';

/** What a signed-in grower sees of the notices: those for their own farms, with their own copy's state. */
export const growerRouter = Router();

growerRouter.get('/notices', requireRole('grower'), async (req, res) => {
  res.json({ notices: await listGrowerNotices(actor(req)) });
});
