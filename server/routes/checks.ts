import { Router, type Request, type Response } from 'express';
import { z, type ZodError } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { AppError, fromZod } from '../errors.ts';
import { checkRequestSchema, sensitivityRequestSchema, type CheckRequest } from '../../shared/schemas/checks.ts';
import { getCheckAnswer, requestCheck } from '../services/checks.ts';
import { sensitivityStrip } from '../services/sensitivity.ts';
import { checkDensityGrid } from '../services/check-density.ts';
import type { SerialisedAnswer } from '../services/check-answer-cache.ts';
import { getCheckPart, type CheckPart } from '../services/check-parts.ts';

// Scouts never see checks; growers see only what a zone notice shows them, so both are refused here.
export const checksRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That pattern check id is not valid.' }) });

/** The engine's own option messages, led by the option's name so the adviser knows which one to fix. */
function optionError(error: ZodError): AppError {
  const base = fromZod(error);
  const issue = error.issues[0];
  if (issue?.path[0] !== 'options') return base;
  const named = issue.path.slice(1).join('.');
  const message =
    issue.code === 'unrecognized_keys'
      ? `${issue.keys.map((k) => `"${k}"`).join(', ')} ${issue.keys.length === 1 ? 'is not a check option' : 'are not check options'}; remove ${issue.keys.length === 1 ? 'it' : 'them'}.`
      : `Option "${named || 'options'}": ${issue.message}`;
  return new AppError(400, 'invalid_option', message, base.fields);
}

function parseCheckRequest(body: unknown, schema = checkRequestSchema): CheckRequest {
  const result = schema.safeParse(body);
  if (!result.success) throw optionError(result.error);
  return result.data;
}

// 200 an identical check was stored already, 201 computed in this request, 202 queued (poll the check).
const statusFor = { stored: 200, computed: 201, queued: 202 } as const;

checksRouter.post('/', requireRole('adviser', 'admin'), async (req, res) => {
  const outcome = await requestCheck(actor(req), parseCheckRequest(req.body));
  res.status(statusFor[outcome.happened]).type('json').send(outcome.json);
});

checksRouter.post('/sensitivity', requireRole('adviser', 'admin'), async (req, res) => {
  res.json(await sensitivityStrip(actor(req), parseCheckRequest(req.body, sensitivityRequestSchema)));
});

/** Sends pre-serialised JSON: the stored gzip when the client takes it, 304 when its copy is current. */
function sendSerialised(req: Request, res: Response, answer: SerialisedAnswer) {
  res.setHeader('ETag', answer.etag);
  res.vary('Accept-Encoding');
  res.type('json');
  if (req.fresh) return void res.status(304).end();
  if (answer.gzip && req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    // Already encoded, so the compression middleware leaves it alone.
    res.setHeader('Content-Encoding', 'gzip');
    return void res.send(answer.gzip);
  }
  res.send(answer.json);
}

checksRouter.get('/:id', requireRole('adviser', 'admin'), async (req, res) => {
  sendSerialised(req, res, await getCheckAnswer(actor(req), parse(idParam, req.params).id));
});

/** The density grid as 64-bit little-endian floats (row-major from the south, NaN outside the field), fetched when the map shows it. */
checksRouter.get('/:id/density', requireRole('adviser', 'admin'), async (req, res) => {
  const bytes = await checkDensityGrid(actor(req), parse(idParam, req.params).id);
  res.type('application/octet-stream').setHeader('Cache-Control', 'private, no-cache');
  res.send(bytes);
});

// The parts that grow with the sightings, each fetched when the layer or table that shows it opens (check-parts.ts).
const parts: CheckPart[] = ['stops', 'quadrats', 'scouted-area', 'not-scouted-area', 'sighting-ids'];
for (const part of parts) {
  checksRouter.get(`/:id/${part}`, requireRole('adviser', 'admin'), async (req, res) => {
    sendSerialised(req, res, await getCheckPart(actor(req), parse(idParam, req.params).id, part));
  });
}
