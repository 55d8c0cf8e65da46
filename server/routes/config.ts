import { Router } from 'express';
import { config } from '../config.ts';
import { actor, requireRole } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { dateFormatSchema } from '../../shared/schemas/date-format.ts';
import { changeDateFormat, dateFormatOf } from '../services/organisation-date-format.ts';

/** What the client needs to know about this deployment and the signed-in organisation's date format; nothing secret. */
export const configRouter = Router();

configRouter.get('/', async (req, res) => {
  // On a signed-in request the format was read with the session: this answer needs no query of its own.
  const dateFormat = await dateFormatOf(req.user);
  res.json({ tileUrl: config.tileUrl, mailCatcher: config.mailboxServed, dateFormat });
});

configRouter.put('/date-format', requireRole('admin'), async (req, res) => {
  res.json({ dateFormat: await changeDateFormat(actor(req), parse(dateFormatSchema, req.body)) });
});
