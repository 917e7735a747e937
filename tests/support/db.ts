import { randomBytes } from 'node:crypto';
import pg from 'pg';

function admin(): string {
  const url = process.env.TEST_PG_ADMIN_URL;
  if (!url) throw new Error('TEST_PG_ADMIN_URL is not set: run the tests with `npm test`.');
  return url;
}

/**
 * A fresh database copied from the migrated template; each test file gets its own. `url` logs in as the
 * application's role (breakover_app), as the server does; `ownerUrl` as the owner, for tamper tests.
 */
export async function createTestDatabase(): Promise<{ url: string; ownerUrl: string; drop: () => Promise<void> }> {
  const name = `t_${randomBytes(6).toString('hex')}`;
  const client = new pg.Client({ connectionString: admin() });
  await client.connect();
  // Template copies fail while another session is connected to the template: retry briefly.
  for (let attempt = 0; ; attempt++) {
    try {
      await client.query(`create database "${name}" template "${process.env.TEST_PG_TEMPLATE ?? 'bo_template'}"`);
      break;
    } catch (err) {
      if (attempt > 20) throw err;
      await new Promise((r) => setTimeout(r, 100 + Math.random() * 200));
    }
  }
  await client.end();
  const owner = new URL(admin());
  owner.pathname = `/${name}`;
  const app = new URL(owner);
  app.username = 'breakover_app';
  app.password = '';
  return {
    url: app.toString(),
    ownerUrl: owner.toString(),
    drop: async () => {
      const c = new pg.Client({ connectionString: admin() });
      await c.connect();
      await c.query(`drop database if exists "${name}" with (force)`);
      await c.end();
    },
  };
}
