import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';
import helmet from 'helmet';
import type pg from 'pg';
import type { Config } from './config.js';
import { systemClock, type Clock } from './clock.js';
import { createDatabase, createPool } from './db/client.js';
import { watchPool } from './db/outage.js';
import { createMailer, type MailTransport } from './mail/mailer.js';
import { makeAudit } from './audit/audit.service.js';
import type { Deps } from './deps.js';
import { buildRouteTable, buildServices } from './features.js';
import { mountRoutes } from './routing.js';
import { actorMiddleware, sessionMiddleware } from './middleware/session.js';
import { originCheck } from './middleware/csrf.js';
import { errorHandler, notFoundApi } from './middleware/errors.js';
import { passwordAttemptLimits } from './auth/rate-limit.js';
import type { JobsOptions } from './jobs/index.js';
import { createLogger, requestLogger, type Logger } from './logging.js';

export interface AppOptions {
  config: Config;
  clock?: Clock;
  pool?: pg.Pool;
  /** Where mail goes (default: SMTP_URL or the outbox folder); tests put a transport they can make fail. */
  mailTransport?: MailTransport;
  /** Where log lines go; by default the process's logger from the configuration. */
  logger?: Logger;
  /** Start this process's job queue (pg-boss): server/index.ts does, tests that need it do. */
  startJobs?: JobsOptions | boolean;
}

/** Builds the Express app and everything behind it; index.ts listens, tests use it through supertest. */
export function createApp(opts: AppOptions) {
  const { config } = opts;
  const clock = opts.clock ?? systemClock;
  const log = opts.logger ?? createLogger(config.log);
  // A pool given by the caller is watched too: a dropped idle connection must not end the process.
  const pool = watchPool(opts.pool ?? createPool(config.databaseUrl, 10, log), log);
  const db = createDatabase(pool);
  const mailer = createMailer(db, clock, config.mail, opts.mailTransport);
  const deps: Deps = { db, pool, clock, config, mailer, audit: makeAudit(clock), log };
  const services = buildServices(deps);
  const routeTable = buildRouteTable(deps, services);

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(requestLogger(log));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': config.publicUrl.startsWith('https:') ? [] : null,
        },
      },
    }),
  );

  const api = Router();
  api.use(express.json({ limit: '256kb' }));
  api.use(originCheck(config.allowedOrigins));
  mountRoutes(api, routeTable.filter((d) => d.noSession));
  api.use(sessionMiddleware(pool, config, log));
  // Password attempts per address, counted in PostgreSQL so the limit holds across server processes.
  const limits = passwordAttemptLimits(deps);
  api.post('/session', limits.signIn);
  api.post('/password/forgot', limits.signIn);
  api.use(actorMiddleware(services.auth));
  api.use(limits.passwords);
  mountRoutes(api, routeTable.filter((d) => !d.noSession));
  api.use(notFoundApi);
  app.use('/api', api);

  const staticDir = config.staticDir;
  if (existsSync(path.join(staticDir, 'index.html'))) {
    app.use(express.static(staticDir, { index: false, maxAge: '1h' }));
    app.get(/^\/(?!api\/).*/, (_req, res) => res.sendFile(path.join(staticDir, 'index.html')));
  }
  app.use(errorHandler);
  app.locals.routeTable = routeTable;

  const jobsReady = opts.startJobs ? services.jobs.start(opts.startJobs === true ? {} : opts.startJobs) : Promise.resolve();
  const close = async () => {
    await services.jobs.stop();
    await pool.end();
  };
  return { app, deps, services, routeTable, jobs: services.jobs, jobsReady, close };
}
