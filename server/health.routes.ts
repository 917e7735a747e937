import { sql } from 'drizzle-orm';
import { route, type RouteDef } from './routing.js';
import type { Deps } from './deps.js';

export function healthRoutes({ db }: Deps): RouteDef[] {
  return [
    route({
      method: 'get', path: '/health', access: 'public',
      handler: async ({ res }) => {
        try {
          await db.execute(sql`select 1`);
          return { status: 'ok', database: 'up' };
        } catch {
          res.status(503);
          return { status: 'degraded', database: 'down' };
        }
      },
    }),
  ];
}
