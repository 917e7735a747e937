import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors.js';

export function notFoundApi(req: Request, _res: Response, next: NextFunction) {
  next(new AppError(404, 'no_route', `No API route ${req.method} ${req.originalUrl}.`));
}

/** Maps every error to `{ error: { code, message, fields } }`. Express 5 forwards rejected promises here. */
export function errorHandler(err: unknown, _req: Request, res: Response, _next: NextFunction) {
  if (res.headersSent) return;
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, fields: err.fields } });
    return;
  }
  const e = err as { type?: string; status?: number; code?: string; message?: string };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (e?.type === 'entity.too.large' || e?.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json({ error: { code: 'too_large', message: 'The request is larger than allowed.' } });
    return;
  }
  if (e?.status && e.status >= 400 && e.status < 500) {
    res.status(e.status).json({ error: { code: 'bad_request', message: e.message ?? 'Bad request.' } });
    return;
  }
  // Constraint violations that slipped past validation are conflicts, not crashes.
  const pgCode = (err as { code?: string; cause?: { code?: string } })?.cause?.code ?? e?.code;
  if (pgCode === '23505' || pgCode === '23P01') {
    res.status(409).json({ error: { code: 'conflict', message: 'That would duplicate or overlap an existing record.' } });
    return;
  }
  console.error('[server] unexpected error', err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server.' } });
}
