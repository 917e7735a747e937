import pg from 'pg';

export const APP_ROLE = 'breakover_app';

/**
 * Refuses a DATABASE_URL that does not log in as the restricted role: a login as the owner or a superuser
 * would let any injected SQL take back every right (RESET ROLE), so the server does not start on one.
 */
export async function assertAppLogin(url: string): Promise<void> {
  const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 5_000 });
  // A connection dropped mid-check also rejects the query; unheard, the 'error' event would end the process.
  client.on('error', () => undefined);
  await client.connect();
  try {
    const { rows } = await client.query<{ login: string; elevated: boolean; memberships: number }>(
      `select session_user as login,
         r.rolsuper or r.rolcreaterole or r.rolcreatedb or r.rolreplication or r.rolbypassrls as elevated,
         (select count(*)::int from pg_auth_members m where m.member = r.oid) as memberships
       from pg_roles r where r.rolname = session_user`,
    );
    const { login, elevated, memberships } = rows[0];
    if (login !== APP_ROLE) {
      throw new Error(
        `DATABASE_URL logs in as "${login}"; the application must log in as ${APP_ROLE}, its own restricted role. ` +
          `Give DATABASE_URL the user ${APP_ROLE} and put the owner's URL (for migrations) in DATABASE_OWNER_URL.`,
      );
    }
    if (elevated || memberships > 0) {
      throw new Error(`${APP_ROLE} has more rights than its grants (a role attribute or a role membership): run the migrations again as the owner.`);
    }
  } finally {
    await client.end();
  }
}
