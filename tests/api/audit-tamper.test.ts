import { describe, it, expect, beforeEach } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { appendAnchorLine, ids, seal, smallWrite, tamper, verify } from '../support/audit.js';

// A fresh app per test: each tampers with its own trail.
let t: TestApp;
beforeEach(async () => {
  t = await makeTestApp();
  for (let i = 0; i < 5; i++) await smallWrite(t, `w${i}`);
  await verify(t); // the auditor's sign-in is an entry too
  await seal(t, { anchor: true });
});

const kinds = (r: Awaited<ReturnType<typeof verify>>) => r.issues.map((i) => i.kind);

describe('audit trail tampering, as a database superuser', () => {
  it('when untouched, then it verifies against its anchor', async () => {
    const r = await verify(t);
    expect(r).toMatchObject({ intact: true, unsealed: 0, anchors: 1, issueCount: 0 });
    expect(r.lastAnchor).toMatchObject({ id: r.head!.id, hmac: r.head!.hmac, line: 1 });
  });

  it('when the last entry and its seal are deleted, then it names a truncated tail at the anchored entry', async () => {
    const all = await ids(t);
    const last = all[all.length - 1];
    await tamper(t, `delete from audit_seal where entry_id = ${last}; delete from audit_log where id = ${last}`);
    const r = await verify(t);
    expect(r.intact).toBe(false);
    expect(r.issues).toEqual([expect.objectContaining({ kind: 'truncated_tail', entryId: last, anchorLine: 1 })]);
    expect(r.issues[0].detail).toContain(`now ends at #${all[all.length - 2]}`);
  });

  it('when a middle entry and its seal are deleted, then it names a gap at the entry after it, by position', async () => {
    const all = await ids(t);
    const gone = all[3];
    await tamper(t, `delete from audit_seal where entry_id = ${gone}; delete from audit_log where id = ${gone}`);
    const r = await verify(t);
    expect(r.issues).toEqual([expect.objectContaining({ kind: 'gap', entryId: all[4], position: 4 })]);
    expect(r.issues[0].detail).toContain(`follows #${gone}`);
  });

  it('when an entry\'s new values are edited, then it names that entry as edited at its position, and only it', async () => {
    const target = (await ids(t))[2];
    await tamper(t, `update audit_log set new_values = '{"entityId": "changed"}' where id = ${target}`);
    const r = await verify(t);
    expect(r.issues).toEqual([expect.objectContaining({ kind: 'edited', entryId: target, position: 3, entry: expect.objectContaining({ id: target, newValues: { entityId: 'changed' } }) })]);
  });

  it('when the whole chain is rebuilt with another key, then no seal checks and the anchor names the rebuilt head', async () => {
    const head = (await verify(t)).head!;
    await tamper(t, 'delete from audit_seal');
    await seal(t, {}, 'c3'.repeat(32));
    const r = await verify(t);
    expect(r.intact).toBe(false);
    expect(r.issueCount).toBe(head.position + 1);
    expect(kinds(r).filter((k) => k === 'edited')).toHaveLength(head.position);
    expect(r.issues.find((i) => i.kind === 'anchor_mismatch')).toMatchObject({ entryId: head.id, anchorLine: 1 });
  });

  it('when the head no longer matches the last anchor, then that anchor is named', async () => {
    await smallWrite(t, 'later');
    await seal(t, { anchor: true });
    const { head } = await verify(t);
    await tamper(t, `update audit_seal set hmac = repeat('0', 64) where entry_id = ${head!.id}`);
    const r = await verify(t);
    expect(r.issues).toContainEqual(expect.objectContaining({ kind: 'anchor_mismatch', entryId: head!.id, anchorLine: 2 }));
    expect(r.issues).toContainEqual(expect.objectContaining({ kind: 'edited', entryId: head!.id }));
  });

  it('when an anchor line is written without the key, then it is named as not genuine', async () => {
    appendAnchorLine(t, `2026-03-02T10:00:00.000Z\t1\t${'f'.repeat(64)}\t${'e'.repeat(64)}`);
    const r = await verify(t);
    expect(r.issues).toEqual([expect.objectContaining({ kind: 'anchor_forged', anchorLine: 2 })]);
  });

  it('when a second seal claims an entry that already has a successor, then it names the fork', async () => {
    const all = await ids(t);
    await smallWrite(t, 'forked');
    const forked = Math.max(...(await ids(t)));
    await tamper(t, `drop index audit_seal_prev_uq;
      insert into audit_seal (entry_id, prev_id, hmac, sealed_at) values (${forked}, ${all[1]}, repeat('a', 64), now())`);
    const r = await verify(t);
    expect(r.issues).toEqual([expect.objectContaining({ kind: 'fork', entryId: forked, position: all.length + 1 })]);
  });

  it('when an entry is slipped into a hole below the sealed head, then it is named, not taken for "not yet sealed"', async () => {
    await t.deps.db.transaction(async (tx) => {
      await t.deps.audit(tx, { actorId: null, action: 'test.rolled_back', entity: 'test', entityId: 'x' });
      tx.rollback();
    }).catch(() => undefined);
    await smallWrite(t, 'after-hole');
    await seal(t);
    const hole = Math.max(...(await ids(t))) - 1;
    await tamper(t, `insert into audit_log (id, at, action, entity, entity_id) values (${hole}, now(), 'test.slipped', 'test', 'x')`);
    const r = await verify(t);
    expect(r).toMatchObject({ intact: false, unsealed: 0 });
    expect(r.issues).toEqual([expect.objectContaining({ kind: 'unsealed_inside', entryId: hole })]);
  });
});
