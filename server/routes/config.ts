import { Router } from 'express';
import { config } from '../config.ts';

/** What the client needs to know about this deployment; nothing secret. */
export const configRouter = Router();

configRouter.get('/', (_req, res) => {
  res.json({ tileUrl: config.tileUrl, mailCatcher: config.mailboxServed });
});
