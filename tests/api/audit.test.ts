import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { verifyChain } from '../../server/audit/audit.verify.js';
import { sql } from 'drizzle-orm';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});

describe('audit trail', () => {
  it('when 50 writers append at once, then the chain stays one unbroken line', async () => {
    const before = await verifyChain(t.deps.db);
    expect(before.intact).toBe(true);
    await Promise.all(
      Array.from({ length: 50 }, (_, i) =>
        t.deps.db.transaction((tx) => t.deps.audit(tx, { actorId: null, action: 'test.parallel', entity: 'test', entityId: String(i), newValues: { i, note: 'Ω α ≤ Łódź' } })),
      ),
    );
    const after = await verifyChain(t.deps.db);
    expect(after).toEqual({ intact: true, entries: (before as { entries: number }).entries + 50 });
    const forks = await t.ownerQuery('select prev_hash, count(*) from audit_log group by prev_hash having count(*) > 1');
    expect(forks.rowCount).toBe(0);
  });

  it('when the application connection tries UPDATE, DELETE or TRUNCATE on it, then the database refuses', async () => {
    for (const stmt of [sql`update audit_log set action = 'x'`, sql`delete from audit_log`, sql`truncate audit_log`]) {
      const outcome = await t.deps.db.execute(stmt).then(
        () => 'went through',
        (e: Error & { cause?: Error }) => e.cause?.message ?? e.message,
      );
      expect(outcome).toMatch(/permission denied|append-only/);
    }
    const role = await t.deps.db.execute(sql`select current_user as u`);
    expect(role.rows[0].u).toBe('breakover_app');
  });

  it('when even the owner tries UPDATE or DELETE, then the trigger refuses', async () => {
    await expect(t.ownerQuery(`update audit_log set action = 'x' where id = 1`)).rejects.toThrow(/append-only/);
    await expect(t.ownerQuery(`delete from audit_log where id = 1`)).rejects.toThrow(/append-only/);
  });

  it('when a row is altered behind the guard, then verification names that entry', async () => {
    const target = Number((await t.ownerQuery('select id from audit_log order by id limit 1 offset 3')).rows[0].id);
    await t.ownerQuery(`begin; alter table audit_log disable trigger audit_log_no_update_delete;
      update audit_log set new_values = '{"tampered": true}' where id = ${target};
      alter table audit_log enable trigger audit_log_no_update_delete; commit;`);
    const report = await verifyChain(t.deps.db);
    expect(report).toMatchObject({ intact: false, firstBadId: target, reason: 'hash' });
  });
});
