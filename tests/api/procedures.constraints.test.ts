import { describe, it, expect, beforeAll } from 'vitest';
import pg from 'pg';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { createDraft, draftBody, publishNew } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, admin: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2] = await Promise.all([signIn(t, DEMO.manager), signIn(t, DEMO.manager2)]);
  // A third manager, so that two approvers who are not the author can race each other.
  const invite = await manager.post('/api/people').send({ email: 'third.manager@demo.breakover.test', name: 'Third Manager', siteId: manager.user.site.id, roles: ['technician'] });
  expect(invite.status).toBe(201);
  admin = await signIn(t, DEMO.admin);
  expect((await admin.patch(`/api/people/${invite.body.id}`).send({ roles: ['manager'] })).status).toBe(200);
  await t.ownerQuery(`update users set password_hash = (select password_hash from users where email = $1) where id = $2`, [DEMO.manager, invite.body.id]);
});

const countPublished = async (id: string) =>
  (await t.ownerQuery(`select count(*)::int as n from procedure_versions where procedure_id = $1 and status = 'published'`, [id])).rows[0].n;

async function client() {
  const c = new pg.Client({ connectionString: t.database.url });
  await c.connect();
  return c;
}

describe('one published version per procedure', () => {
  it('when two managers approve the same version at the same moment, then one wins and exactly one version is published', async () => {
    const third = await signIn(t, 'third.manager@demo.breakover.test');
    const d = await createDraft(manager);
    await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`);
    const url = `/api/procedures/${d.id}/versions/${d.versionId}/approve`;
    const results = await Promise.all([manager2.post(url).send({ password: DEMO_PASSWORD }), third.post(url).send({ password: DEMO_PASSWORD })]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(await countPublished(d.id)).toBe(1);
    const sigs = await t.ownerQuery(`select count(*)::int as n from signatures where entity_id = $1 and meaning = 'approved for use'`, [d.versionId]);
    expect(sigs.rows[0].n).toBe(1);
  });

  it('when two transactions write a published version of one procedure at once, then the database refuses the second', async () => {
    const d = await publishNew(manager, manager2);
    const a = await client();
    const b = await client();
    try {
      const template = (await a.query(`select * from procedure_versions where id = $1`, [d.versionId])).rows[0];
      // Move the one in force aside, then let two writers each put a new published version in its place.
      await a.query(`update procedure_versions set status = 'superseded', superseded_at = now() where id = $1`, [d.versionId]);
      const insert = (c: pg.Client, n: number) =>
        c.query(
          `insert into procedure_versions (procedure_id, number, status, title, category, review_period_months, scope, hazards, ppe, equipment,
             change_class, change_summary, reread_days, author_id, created_at, updated_at, approved_by, approval_signature_id, published_at, review_due_on, ack_from_number)
           select procedure_id, $2, 'published', title, category, review_period_months, scope, hazards, ppe, equipment, 'editorial', 'race',
             reread_days, author_id, now(), now(), approved_by, approval_signature_id, now(), review_due_on, 1 from procedure_versions where id = $1`,
          [template.id, n],
        );
      await a.query('begin');
      await b.query('begin');
      await insert(a, 2);
      // b waits on a's unique-index entry; once a commits, b fails.
      const second = insert(b, 3).then(() => 'inserted', (err: { code: string; constraint?: string }) => `${err.code} ${err.constraint}`);
      await new Promise((r) => setTimeout(r, 200));
      await a.query('commit');
      expect(await second).toBe('23505 procedure_versions_one_published_uq');
      await b.query('rollback');
      expect(await countPublished(d.id)).toBe(1);
    } finally {
      await a.end();
      await b.end();
    }
  });

  it('when anything tries to change a published version or its steps directly, then the database refuses', async () => {
    const d = await publishNew(manager, manager2);
    const c = await client();
    try {
      await expect(c.query(`update procedure_versions set scope = 'changed behind the app' where id = $1`, [d.versionId])).rejects.toThrow(/content cannot change/);
      await expect(c.query(`update procedure_steps set text = 'changed' where version_id = $1`, [d.versionId])).rejects.toThrow(/refused: the version is published/);
      await expect(c.query(`delete from procedure_checklists where version_id = $1`, [d.versionId])).rejects.toThrow(/refused/);
      await expect(c.query(`update procedure_versions set status = 'draft' where id = $1`, [d.versionId])).rejects.toThrow(/may not go from published to draft/);
      await expect(c.query(`delete from procedure_acknowledgements`)).rejects.toThrow(/permission denied/);
    } finally {
      await c.end();
    }
    expect((await manager.get(`/api/procedures/${d.id}/versions/${d.versionId}`)).body.scope).toBe(draftBody().scope);
  });

  it('when an approval would put the author down as approver, then the database check refuses it', async () => {
    const d = await createDraft(manager);
    await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`);
    await expect(t.ownerQuery(`update procedure_versions set approved_by = author_id where id = $1`, [d.versionId])).rejects.toThrow(/procedure_versions_four_eyes_ck/);
  });
});
