import type pg from 'pg';
import type { Database } from './db/client.js';
import type { Clock } from './clock.js';
import type { Config } from './config.js';
import type { Mailer } from './mail/mailer.js';
import type { Audit } from './audit/audit.service.js';
import type { Logger } from './logging.js';

/** What every feature's services are built from; createApp assembles it once. */
export interface Deps {
  db: Database;
  pool: pg.Pool;
  clock: Clock;
  config: Config;
  mailer: Mailer;
  audit: Audit;
  log: Logger;
}
