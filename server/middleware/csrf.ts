import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cookie-authenticated writes must come from our own pages: a browser always sends Origin (or
 * Sec-Fetch-Site) on a cross-site POST, so a foreign one is refused. Clients that send neither are not
 * browsers and carry no ambient cookie risk.
 */
export function originCheck(allowed: Set<string>) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin && !allowed.has(origin)) {
      return next(new AppError(403, 'bad_origin', `Requests from ${origin} are not accepted.`));
    }
    const site = req.get('sec-fetch-site');
    if (!origin && site && site !== 'same-origin' && site !== 'none') {
      return next(new AppError(403, 'bad_origin', 'Cross-site requests are not accepted.'));
    }
    next();
  };
}
