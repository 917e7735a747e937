import { describe, it, expect, beforeAll } from 'vitest';
import { sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/app.js';
import { seal, smallWrite, verify } from '../support/audit.js';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});

describe('audit trail', () => {
  it('when entries are written, then they stand unsealed ("not yet sealed", no fault) until the sealer runs', async () => {
    await smallWrite(t, 'before-seal');
    const before = await verify(t);
    expect(before).toMatchObject({ intact: true, sealed: 0, issues: [] });
    expect(before.unsealed).toBe(before.entries);
    expect(before.unsealed).toBeGreaterThan(0);
    const run = await seal(t);
    expect(run).toMatchObject({ sealed: before.entries, caughtUp: true });
    expect(await verify(t)).toMatchObject({ intact: true, sealed: before.entries, unsealed: 0, head: { position: before.entries } });
  });

  it('when 50 writers append at once, then after sealing the chain is one unbroken line with all of them', async () => {
    const { entries } = await verify(t);
    await Promise.all(
      Array.from({ length: 50 }, (_, i) =>
        t.deps.db.transaction((tx) => t.deps.audit(tx, { actorId: null, action: 'test.parallel', entity: 'test', entityId: String(i), newValues: { i, note: 'Ω α ≤ Łódź' } })),
      ),
    );
    await seal(t);
    expect(await verify(t)).toMatchObject({ intact: true, entries: entries + 50, sealed: entries + 50, unsealed: 0 });
    const forks = await t.ownerQuery('select prev_id from audit_seal group by prev_id having count(*) > 1');
    expect(forks.rowCount).toBe(0);
  });

  it('when a transaction rolls back after taking an entry number, then the hole in the numbers is no gap', async () => {
    await t.deps.db.transaction(async (tx) => {
      await t.deps.audit(tx, { actorId: null, action: 'test.rolled_back', entity: 'test', entityId: 'x' });
      tx.rollback();
    }).catch(() => undefined);
    await smallWrite(t, 'after-rollback');
    await seal(t);
    const rows = (await t.ownerQuery(`select s.entry_id, s.prev_id from audit_seal s order by entry_id desc limit 1`)).rows[0];
    expect(Number(rows.entry_id) - Number(rows.prev_id)).toBe(2);
    expect(await verify(t)).toMatchObject({ intact: true, unsealed: 0 });
  });

  it('when the application connection tries UPDATE, DELETE or TRUNCATE on the trail or its seals, then the database refuses', async () => {
    for (const table of ['audit_log', 'audit_seal']) {
      for (const stmt of [sql.raw(`update ${table} set ${table === 'audit_log' ? 'action' : 'hmac'} = 'x'`), sql.raw(`delete from ${table}`), sql.raw(`truncate ${table}`)]) {
        const outcome = await t.deps.db.execute(stmt).then(
          () => 'went through',
          (e: Error & { cause?: Error }) => e.cause?.message ?? e.message,
        );
        expect(outcome).toMatch(/permission denied|append-only/);
      }
    }
    const role = await t.deps.db.execute(sql`select current_user as u`);
    expect(role.rows[0].u).toBe('breakover_app');
  });

  it('when even the owner tries UPDATE or DELETE, then the triggers refuse', async () => {
    await expect(t.ownerQuery(`update audit_log set action = 'x' where id = 1`)).rejects.toThrow(/append-only/);
    await expect(t.ownerQuery(`delete from audit_seal where entry_id = 1`)).rejects.toThrow(/audit_seal is append-only/);
  });

  it('when a writer supplies its own entry number, then the trigger takes the next one from the sequence anyway', async () => {
    await t.deps.db.transaction((tx) => tx.execute(sql`insert into audit_log (id, at, action, entity, entity_id) values (1, now(), 'test.own_id', 'test', 'x')`));
    const row = (await t.ownerQuery(`select id, tx is not null as stamped from audit_log where action = 'test.own_id'`)).rows[0];
    expect(Number(row.id)).toBeGreaterThan(1);
    expect(row.stamped).toBe(true);
  });
});
