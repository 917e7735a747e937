import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { NextFunction, Request, Response } from 'express';
import type pg from 'pg';
import type { Config } from '../config.js';
import { defineAbilityFor } from '../../shared/abilities.js';
import type { AuthService } from '../auth/auth.service.js';
import type { Logger } from '../logging.js';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
  }
}

export function sessionMiddleware(pool: pg.Pool, config: Config, log?: Logger) {
  const Store = connectPgSimple(session);
  // A failed prune (the database away) is logged and tried again at the next interval; a failed read
  // reaches the error handler (503), so a signed-in person is not signed out by an outage.
  const errorLog = (...args: unknown[]) => log?.warn({ err: args.find((a) => a instanceof Error) }, `session store: ${args.filter((a) => typeof a === 'string').join(' ')}`);
  return session({
    store: new Store({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60, errorLog }),
    name: 'breakover.sid',
    secret: config.sessionSecret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: 12 * 3_600_000 },
  });
}

/** Puts the signed-in actor and their ability on res.locals for every request. */
export function actorMiddleware(auth: AuthService) {
  return async (req: Request, res: Response, next: NextFunction) => {
    res.locals.actor = null;
    res.locals.user = null;
    const userId = req.session?.userId;
    if (userId) {
      const loaded = await auth.loadActor(userId);
      if (loaded) {
        res.locals.actor = loaded.actor;
        res.locals.user = loaded.user;
      } else {
        await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      }
    }
    res.locals.ability = defineAbilityFor(res.locals.actor);
    next();
  };
}
