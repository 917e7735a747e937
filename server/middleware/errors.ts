import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors.js';
import { isDatabaseUnavailable } from '../db/outage.js';

/** Seconds a client should wait before trying again while the database is away. */
export const DATABASE_RETRY_AFTER_S = 5;

export function notFoundApi(req: Request, _res: Response, next: NextFunction) {
  next(new AppError(404, 'no_route', `No API route ${req.method} ${req.originalUrl}.`));
}

type Reply = { status: number; code: string; message: string; fields?: Record<string, string>; retryAfter?: number };

/** What a thrown error means to the caller; null when it is a fault of ours. */
function replyFor(err: unknown): Reply | null {
  if (err instanceof AppError) return { status: err.status, code: err.code, message: err.message, fields: err.fields };
  const e = err as { type?: string; status?: number; code?: string; message?: string };
  if (e?.type === 'entity.parse.failed') return { status: 400, code: 'malformed_json', message: 'The request body is not valid JSON.' };
  if (e?.type === 'entity.too.large' || e?.code === 'LIMIT_FILE_SIZE') return { status: 413, code: 'too_large', message: 'The request is larger than allowed.' };
  if (e?.status && e.status >= 400 && e.status < 500) return { status: e.status, code: 'bad_request', message: e.message ?? 'Bad request.' };
  // Constraint violations that slipped past validation are conflicts, not crashes.
  const pgCode = (err as { code?: string; cause?: { code?: string } })?.cause?.code ?? e?.code;
  if (pgCode === '23505' || pgCode === '23P01') return { status: 409, code: 'conflict', message: 'That would duplicate or overlap an existing record.' };
  // The database restarting or gone: nothing the caller did wrong, and worth trying again shortly.
  if (isDatabaseUnavailable(err)) {
    const message = `The database is not reachable at the moment. Try again in ${DATABASE_RETRY_AFTER_S} seconds.`;
    return { status: 503, code: 'database_unavailable', message, retryAfter: DATABASE_RETRY_AFTER_S };
  }
  return null;
}

/**
 * Maps every error to `{ error: { code, message, fields, requestId } }`; the request id is the one in the
 * log line, so a person reporting a problem can quote it. Express 5 forwards rejected promises here.
 */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  if (res.headersSent) return;
  const requestId = req.id === undefined ? undefined : String(req.id);
  const reply = replyFor(err);
  if (reply) {
    if (reply.retryAfter) res.set('Retry-After', String(reply.retryAfter));
    res.status(reply.status).json({ error: { code: reply.code, message: reply.message, fields: reply.fields, requestId } });
    return;
  }
  req.log?.error({ err }, 'unexpected error');
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server.', requestId } });
}
