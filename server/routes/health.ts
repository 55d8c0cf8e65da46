import { Router } from 'express';
import { processReadiness } from '../services/readiness.ts';

/** Probes for a load balancer or orchestrator: `/healthz` says the process is up, `/readyz` that it can serve. */
export const healthRouter = Router();

healthRouter.get('/healthz', (_req, res) => {
  res.json({ status: 'up' });
});

healthRouter.get('/readyz', async (_req, res) => {
  const readiness = await processReadiness();
  res.status(readiness.ready ? 200 : 503).json(readiness);
});
