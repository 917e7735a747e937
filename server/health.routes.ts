import { sql } from 'drizzle-orm';
import { route, withStatus, type RouteDef } from './routing.js';
import type { Deps } from './deps.js';

/** How long the health check waits for the database before it calls it down. */
export const HEALTH_DB_TIMEOUT_MS = 2_000;

/** Resolves when the database answered within the bound; rejects otherwise. */
async function databaseAnswers(db: Deps['db']): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error('no answer in time')), HEALTH_DB_TIMEOUT_MS);
  });
  try {
    await Promise.race([db.execute(sql`select 1`), late]);
  } finally {
    clearTimeout(timer);
  }
}

// Both probes answer before the session cookie is read, so neither needs the database for that.
export function healthRoutes({ db }: Deps): RouteDef[] {
  return [
    // Liveness: the process runs and answers; a supervisor restarts it only when this fails.
    route({ method: 'get', path: '/live', access: 'public', noSession: true, handler: async () => ({ status: 'live' }) }),
    // Readiness: 503 while the database does not answer, so a load balancer sends requests elsewhere.
    route({
      method: 'get', path: '/health', access: 'public', noSession: true,
      handler: async () => {
        try {
          await databaseAnswers(db);
          return { status: 'ok', database: 'up' };
        } catch {
          return withStatus(503, { status: 'degraded', database: 'down' });
        }
      },
    }),
  ];
}
