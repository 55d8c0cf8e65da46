import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { BoundaryError } from '../shared/boundary/boundary-faults.ts';
import { logger } from './logger.ts';

/** The one error type the API throws: an HTTP status and a message written for the person using it. */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message);
export const unauthorised = () => new AppError(401, 'unauthorised', 'Sign in to continue.');
export const badRequest = (message: string, fields?: Record<string, string>) => new AppError(400, 'invalid', message, fields);
export const conflict = (message: string) => new AppError(409, 'conflict', message);

export function fromZod(error: ZodError): AppError {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  const first = error.issues[0];
  return new AppError(400, 'invalid', first?.message ?? 'The request is not valid.', fields);
}

// Postgres errors that come from the database's own constraints, phrased for users.
function fromDatabase(error: { name?: string; parent?: { code?: string; constraint?: string } }): AppError | null {
  const code = error.parent?.code;
  if (code === '23505') return conflict('That name or e-mail address is already in use.');
  if (code === '23503') return badRequest('A linked record does not exist or is still in use.');
  if (code === '23514') return badRequest('A value breaks one of the rules for this record.');
  if (code === '22P02') return badRequest('An identifier in the request is not valid.');
  return null;
}

// SQLSTATE classes 08 (connection exception) and 57P (operator intervention: shutdown, crash, starting up),
// and the socket errors pg raises itself; checked on the error, Sequelize's `parent` and the session store's own.
const UNAVAILABLE_CODES = new Set(['57P01', '57P02', '57P03', '08000', '08001', '08003', '08004', '08006', 'ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT']);
type MaybeDbError = { name?: string; code?: string; message?: string; parent?: MaybeDbError; original?: MaybeDbError };

function isDatabaseUnavailable(error: MaybeDbError | undefined, depth = 0): boolean {
  if (!error || depth > 3) return false;
  if (error.name?.startsWith('SequelizeConnection')) return true;
  if (error.code && UNAVAILABLE_CODES.has(error.code)) return true;
  if (/^Connection terminated|connection timeout|Client has encountered a connection error/i.test(error.message ?? '')) return true;
  return isDatabaseUnavailable(error.parent, depth + 1) || isDatabaseUnavailable(error.original, depth + 1);
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let error: AppError;
  if (err instanceof AppError) error = err;
  else if (err instanceof ZodError) error = fromZod(err);
  else if (err instanceof BoundaryError) error = new AppError(400, `boundary_${err.fault.code}`, err.message, { boundary: err.message });
  else if (err?.type === 'entity.too.large')
    error = new AppError(
      413,
      'too_large',
      `The request body is larger than the ${Math.round((err.limit ?? 0) / 1_048_576) || 6} MB limit; send less at a time.`,
    );
  else if (err?.type === 'entity.parse.failed') error = badRequest('The request body is not valid JSON.');
  else if (err?.code === 'EBADCSRFTOKEN' || err?.code === 'invalid_csrf')
    error = new AppError(403, 'csrf', 'This form has expired: reload the page and try again.');
  else if (isDatabaseUnavailable(err)) error = new AppError(503, 'unavailable', 'Patchwise cannot reach its database right now; try again in a minute.');
  else error = fromDatabase(err) ?? new AppError(500, 'internal', 'Something went wrong on our side; the team has been told.');
  if (error.status >= 500 && error.code === 'internal') {
    if (req.log) req.log.error({ err }, 'Unhandled error');
    else logger.error({ err }, 'Unhandled error');
  }
  res.status(error.status).json({ error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) } });
};
