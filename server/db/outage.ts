import type pg from 'pg';

/** What an outage report needs from a logger (pino's, or the console's in scripts). */
export interface OutageLog {
  warn: (obj: object, msg: string) => void;
  info: (msg: string) => void;
}

// SQLSTATEs of a server going away or not taking connections: admin/crash shutdown, cannot connect now,
// and the connection-exception class (08xxx).
const UNAVAILABLE_SQLSTATES = new Set(['57P01', '57P02', '57P03', '08000', '08001', '08003', '08004', '08006']);
const UNAVAILABLE_ERRNOS = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'EAI_AGAIN']);
// node-postgres and pg-pool say it in words only: a dropped socket, a connect that timed out, a broken client.
const UNAVAILABLE_MESSAGES = /Connection terminated|timeout exceeded when trying to connect|connection error and is not queryable|Connection closed/i;

/** Whether an error (or one it wraps: Drizzle keeps the driver's as `cause`) means the database cannot be reached now. */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 4) return false;
  const e = err as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
  if (typeof e.code === 'string' && (UNAVAILABLE_SQLSTATES.has(e.code) || UNAVAILABLE_ERRNOS.has(e.code))) return true;
  if (typeof e.message === 'string' && UNAVAILABLE_MESSAGES.test(e.message)) return true;
  // Node's connect to a name with several addresses fails with an AggregateError of each attempt.
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}

/**
 * Reports an outage once: the first lost connection is a warning, the rest stay quiet until `recovered()`
 * (or, for a source that never says it recovered, until a minute has passed).
 */
export function outageReporter(log: OutageLog, what: string, quietMs = 60_000) {
  let since = 0;
  return {
    lost(err: unknown) {
      const now = Date.now();
      if (since && now - since < quietMs) return;
      since = now;
      const message = (err as Error)?.message ?? String(err);
      log.warn({ err }, `${what}: database connection lost (${message}); retrying on the next request`);
    },
    recovered() {
      if (!since) return;
      since = 0;
      log.info(`${what}: database connection back`);
    },
  };
}

const watched = new WeakSet<pg.Pool>();

/**
 * An idle pooled connection that the server drops (restart, crash, admin shutdown) makes the pool emit
 * 'error'; unheard, that ends the process. The pool has already discarded that client and opens a new
 * one on the next query, so here it is only reported, once per outage.
 */
export function watchPool(pool: pg.Pool, log: OutageLog, what = 'database pool'): pg.Pool {
  if (watched.has(pool)) return pool;
  watched.add(pool);
  const report = outageReporter(log, what);
  pool.on('error', (err) => report.lost(err));
  pool.on('connect', () => report.recovered());
  return pool;
}

/** For the scripts (seeding at start-up), which have no pino logger. */
export const consoleOutageLog: OutageLog = {
  warn: (_obj, msg) => console.warn(`[database] ${msg}`),
  info: (msg) => console.log(`[database] ${msg}`),
};
