import type { TestApp } from './app.js';

/**
 * Everything a change to a person could touch: their row, roles, covered sites, stored sessions and the
 * number of audit entries. Read as the database owner, past the application's own code.
 */
export async function personSnapshot(t: TestApp, id: string) {
  const q = (text: string) => t.ownerQuery(text, [id]).then((r) => r.rows);
  const [row] = await q('select * from users where id = $1');
  return {
    row,
    roles: (await q('select role from user_roles where user_id = $1 order by role')).map((r) => r.role),
    covered: (await q('select site_id from user_sites where user_id = $1 order by site_id')).map((r) => r.site_id),
    sessions: Number((await q(`select count(*) from "session" where sess->>'userId' = $1`))[0].count),
    audit: Number((await t.ownerQuery('select count(*) from audit_log')).rows[0].count),
  };
}
