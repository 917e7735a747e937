// Databases on the test cluster for backup and restore tests that use DATABASE_URL / DATABASE_OWNER_URL.
import pg from 'pg';

const admin = () => process.env.TEST_PG_ADMIN_URL!;

/** The URL of a database on the test cluster, as the owner (postgres) or another login. */
export function urlOf(db: string, user = 'postgres'): string {
  const u = new URL(admin());
  u.username = user;
  u.pathname = `/${db}`;
  return u.toString();
}

export async function query(url: string, sql: string) {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  return c.query(sql).finally(() => c.end());
}

export const onAdmin = (sql: string) => query(admin(), sql);

/** The environment that points backup and restore at one database of the test cluster. */
export const databaseEnv = (db: string) => ({ DATABASE_URL: urlOf(db, 'breakover_app'), DATABASE_OWNER_URL: urlOf(db) });
