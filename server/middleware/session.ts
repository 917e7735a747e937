import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { NextFunction, Request, Response } from 'express';
import type pg from 'pg';
import type { Config } from '../config.js';
import { defineAbilityFor } from '../../shared/abilities.js';
import type { AuthService } from '../auth/auth.service.js';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
  }
}

export function sessionMiddleware(pool: pg.Pool, config: Config) {
  const Store = connectPgSimple(session);
  return session({
    store: new Store({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
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
