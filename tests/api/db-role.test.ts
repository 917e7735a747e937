import { describe, it, expect, beforeAll } from 'vitest';
import type pg from 'pg';
import { makeTestApp, type TestApp } from '../support/app.js';
import { assertAppLogin } from '../../server/db/login-check.js';

// What injected SQL could do on the application's own connection: never more than breakover_app's grants.
let t: TestApp;
let owner: string;
beforeAll(async () => {
  t = await makeTestApp({ seed: false });
  owner = (await t.ownerQuery('select current_user as u')).rows[0].u;
});

/** Runs the statements on one connection of the app's pool, then throws that connection away. */
async function onAppConnection(...statements: string[]): Promise<pg.QueryResult[]> {
  const c = await t.deps.pool.connect();
  try {
    const results = [];
    for (const s of statements) results.push(await c.query(s));
    return results;
  } finally {
    c.release(true);
  }
}

const outcome = (...statements: string[]) =>
  onAppConnection(...statements).then(
    () => 'went through',
    (e: pg.DatabaseError) => `${e.code}: ${e.message}`,
  );

const whoAmI = `select current_user as cur, session_user as ses, current_setting('is_superuser') as sup`;

describe('the application database login', () => {
  it('when the app connection asks who it is, then it logged in as breakover_app, which is no superuser', async () => {
    const [who] = await onAppConnection(whoAmI);
    expect(who.rows[0]).toEqual({ cur: 'breakover_app', ses: 'breakover_app', sup: 'off' });
  });

  it('when it resets its role or its session authorisation, then it is still breakover_app', async () => {
    const results = await onAppConnection('reset role', 'reset session authorization', whoAmI);
    expect(results[2].rows[0]).toEqual({ cur: 'breakover_app', ses: 'breakover_app', sup: 'off' });
  });

  it('when it tries to take on the owner, a superuser or a file or program role, then the database refuses', async () => {
    const roles = ['postgres', owner, 'pg_read_server_files', 'pg_write_server_files', 'pg_execute_server_program', 'pg_read_all_data', 'pg_write_all_data'];
    for (const role of roles) {
      expect(await outcome(`set role "${role}"`), role).toMatch(/^42501: permission denied to set role/);
    }
    expect(await outcome('set session authorization postgres')).toMatch(/^42501: permission denied/);
    expect(await outcome(`set session authorization "${owner}"`)).toMatch(/^42501: permission denied/);
  });

  it('when it tries to create objects, alter the audit trail or read password hashes of roles, then the database refuses', async () => {
    const refused = [
      'create table public.injected (x int)',
      'create table pgboss.injected (x int)',
      'create schema injected',
      `update audit_log set action = 'x'`,
      'delete from audit_log',
      'select rolpassword from pg_authid',
      `copy (select 1) to program 'true'`,
      'alter role breakover_app superuser',
    ];
    for (const s of refused) expect(await outcome(s), s).toMatch(/^42501: /);
  });

  it('when the server is given a DATABASE_URL that logs in as the owner, then it refuses to start and says why', async () => {
    await expect(assertAppLogin(t.database.ownerUrl)).rejects.toThrow(`DATABASE_URL logs in as "${owner}"; the application must log in as breakover_app`);
    await expect(assertAppLogin(t.database.url)).resolves.toBeUndefined();
  });
});
