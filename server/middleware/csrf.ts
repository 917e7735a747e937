import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors.js';
import type { RouteDef } from '../routing.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Every write under /api must show it comes from our own pages, cookie or not (a forged sign-in is a
 * write too). A browser sends Origin on every fetch write; without it we accept only a browser's
 * `Sec-Fetch-Site: same-origin`, or, from a browser too old to send either, a Referer of ours.
 * `Sec-Fetch-Site: none` (typed in the address bar) is never a fetch write, so it is refused as well.
 * Scripts must send `Origin: <PUBLIC_URL>`. The first allowed origin is the public URL's (see config).
 */
export function originCheck(allowed: Set<string>) {
  const publicOrigin = [...allowed][0];
  const refuse = (message: string) => new AppError(403, 'bad_origin', message);
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin) {
      if (!allowed.has(origin)) return next(refuse(`Origin: requests from ${origin} are not accepted; writes must come from ${publicOrigin}.`));
    } else {
      const site = req.get('sec-fetch-site');
      if (site && site !== 'same-origin') return next(refuse(`Sec-Fetch-Site: a ${site} write is not accepted; writes must come from ${publicOrigin}.`));
      if (!site && !allowed.has(originOf(req.get('referer')))) {
        return next(refuse(`Origin: writes must carry an Origin header from ${publicOrigin}.`));
      }
    }
    next(bodyTypeProblem(req));
  };
}

function originOf(url: string | undefined): string {
  try {
    return url ? new URL(url).origin : '';
  } catch {
    return '';
  }
}

/**
 * Bodies are JSON, or a multipart form on the routes that take an upload (those with a `before` hook,
 * read from the route table the app keeps in app.locals). A form or text/plain body is what a foreign
 * page can send without asking first, so it is refused whatever its origin. A body-less write may
 * carry no Content-Type.
 */
function bodyTypeProblem(req: Request): AppError | undefined {
  const type = req.get('content-type');
  const length = req.get('content-length');
  const hasBody = req.get('transfer-encoding') !== undefined || (length !== undefined && length !== '0');
  if (!type && !hasBody) return undefined;
  if (type && req.is('application/json')) return undefined;
  if (type && req.is('multipart/form-data') && takesUpload(req)) return undefined;
  const got = type ? type.split(';')[0].trim() : 'no Content-Type';
  return new AppError(415, 'unsupported_media_type', `Content-Type: send the body as application/json (got ${got}).`, { 'content-type': `send application/json, not ${got}` });
}

const uploadPatterns = new WeakMap<readonly RouteDef[], { method: string; re: RegExp }[]>();

function takesUpload(req: Request): boolean {
  const table = req.app.locals.routeTable as readonly RouteDef[] | undefined;
  if (!table) return false;
  let patterns = uploadPatterns.get(table);
  if (!patterns) {
    patterns = table.filter((r) => r.before).map((r) => ({ method: r.method.toUpperCase(), re: new RegExp(`^${r.path.replace(/:[A-Za-z_]\w*/g, '[^/]+')}/?$`) }));
    uploadPatterns.set(table, patterns);
  }
  return patterns.some((p) => p.method === req.method && p.re.test(req.path));
}
