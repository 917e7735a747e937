import type { Request, Response } from 'express';
import rateLimit, { type Options } from 'express-rate-limit';
import type { Deps } from '../deps.js';
import { PgRateLimitStore } from './rate-limit.store.js';

// Routes the sign-in limiter already counts, and the link's new password (not a guess at an old one).
const COUNTED_ELSEWHERE = new Set(['/session', '/password/forgot', '/password/set']);

/** The body field holding a password the server is about to check, if the request carries one. */
export function passwordFieldOf(req: Request): 'password' | 'currentPassword' | null {
  if (req.method === 'GET' || COUNTED_ELSEWHERE.has(req.path)) return null;
  const body = req.body as Record<string, unknown> | undefined;
  if (typeof body?.password === 'string') return 'password';
  if (typeof body?.currentPassword === 'string') return 'currentPassword';
  return null;
}

/**
 * One limit on password attempts per client address, counted in PostgreSQL so it holds across server
 * processes. Sign-in and the forgotten-password form count every request; signatures and password
 * changes count the requests that fail, against the same count and the same limit.
 */
export function passwordAttemptLimits({ db, clock, config }: Pick<Deps, 'db' | 'clock' | 'config'>) {
  const minutesLeft = (req: Request) => {
    const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
    const ms = reset ? reset.getTime() - clock.now().getTime() : config.signIn.rateWindowMs;
    return Math.max(1, Math.ceil(ms / 60_000));
  };
  const common = (): Partial<Options> => ({
    windowMs: config.signIn.rateWindowMs,
    limit: config.signIn.rateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PgRateLimitStore(db, clock),
  });

  const signIn = rateLimit({
    ...common(),
    handler: (req: Request, res: Response) => {
      const message = `Too many attempts from this address; wait ${minutesLeft(req)} minute(s) and try again.`;
      res.status(429).json({ error: { code: 'rate_limited', message, requestId: String(req.id) } });
    },
  });

  const passwords = rateLimit({
    ...common(),
    skip: (req) => passwordFieldOf(req) === null,
    skipSuccessfulRequests: true,
    handler: (req: Request, res: Response) => {
      const field = passwordFieldOf(req) ?? 'password';
      const reason = `too many password attempts from this address; wait ${minutesLeft(req)} minute(s) and try again`;
      res.status(429).json({ error: { code: 'rate_limited', message: `${field}: ${reason}`, fields: { [field]: reason }, requestId: String(req.id) } });
    },
  });

  return { signIn, passwords };
}
