import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { nextDraft, publishNew } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, tech: Agent, tech3: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, tech, tech3] = await Promise.all([DEMO.manager, DEMO.manager2, DEMO.technician, DEMO.technician3].map((e) => signIn(t, e)));
});

const CODE = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ234567';

/** An authorisation of `holderId` on a scope requiring `kinds` of the procedure, running from `from` to `to`. */
async function authorisation(scopeCode: string, procedureId: string | null, kinds: string[], holderId: string, from: string, to: string, code: string) {
  const scope = await t.ownerQuery(
    `insert into scopes (code, title, description, max_voltage_v, max_current_a, allows_live_work, validity_months, reminder_offsets_days, certificate_grace_days, active, created_at, updated_at)
     values ($1, $1 || ' scope', 'test scope', 250, 5, true, 12, '{30}', 0, true, now(), now()) returning id`, [scopeCode]);
  const scopeId = scope.rows[0].id;
  for (const [i, kind] of kinds.entries()) {
    await t.ownerQuery(`insert into scope_requirements (scope_id, position, kind, procedure_id, practicals_count, practicals_window_months, certificate_kind)
      values ($1, $2, $3, $4, $5, $6, $7)`, [scopeId, i, kind, kind === 'certificate' ? null : procedureId, kind === 'practicals' ? 2 : null, kind === 'practicals' ? 12 : null, kind === 'certificate' ? 'first_aid_cpr' : null]);
  }
  const auth = await t.ownerQuery(`insert into authorisations (holder_id, scope_id, created_at) values ($1, $2, $3) returning id`, [holderId, scopeId, from]);
  await t.ownerQuery(`insert into authorisation_periods (authorisation_id, holder_id, scope_id, starts_at, ends_at, validity_ends_at, origin, verification_code, evidence_snapshot, recorded_at)
    values ($1, $2, $3, $4, $5, $5, 'issued', $6, '{}', $4)`, [auth.rows[0].id, holderId, scopeId, from, to, code]);
  return auth.rows[0].id as string;
}

describe('impact preview', () => {
  it('when a re-assess version is previewed, then it lists the people asked and the running authorisations resting on the procedure', async () => {
    const p = await publishNew(manager, manager2);
    expect((await tech.post(`/api/procedures/${p.id}/versions/${p.versionId}/acknowledge`).send({ password: DEMO_PASSWORD })).status).toBe(201);
    const running = await authorisation('LIVE-PC', p.id, ['procedure_ack', 'practicals'], tech.user.id, '2026-01-01T00:00:00Z', '2027-01-01T00:00:00Z', CODE);
    await authorisation('OLD-PC', p.id, ['procedure_ack'], tech3.user.id, '2025-01-01T00:00:00Z', '2025-12-31T00:00:00Z', CODE.replace('A', 'B'));
    await authorisation('FIRST-AID', null, ['certificate'], tech3.user.id, '2026-01-01T00:00:00Z', '2027-01-01T00:00:00Z', CODE.replace('A', 'C'));

    const v2 = await nextDraft(manager, p.id, (v) => ({
      changeClass: 're-assess', changeSummary: 'A hold point added before the triac is fitted.',
      steps: v.steps.map((s: object, i: number) => (i === 2 ? { ...s, holdPoint: true } : s)),
    }));
    const res = await manager2.get(`/api/procedures/${p.id}/versions/${v2.id}/impact`);
    expect(res.status).toBe(200);
    expect(res.body.asks).toBe('re-assess');
    expect(res.body.people).toEqual([
      { userId: tech.user.id, name: 'Tomasz Wójcik', email: DEMO.technician, siteName: 'Leipzig bench workshop', lastAcknowledgedNumber: 1, dueOn: '2026-03-16' },
    ]);
    expect(res.body.authorisations).toEqual([
      {
        authorisationId: running, holderId: tech.user.id, holderName: 'Tomasz Wójcik', scopeCode: 'LIVE-PC', scopeTitle: 'LIVE-PC scope',
        requires: ['practicals', 'procedure_ack'], runsUntil: '2027-01-01T00:00:00.000Z', practicalsNoLongerCount: true,
      },
    ]);
  });

  it('when the version asks nothing, then nobody is listed, but what rests on the procedure still is', async () => {
    const p = await publishNew(manager, manager2);
    await tech.post(`/api/procedures/${p.id}/versions/${p.versionId}/acknowledge`).send({ password: DEMO_PASSWORD });
    await authorisation('DEAD-W', p.id, ['checklist_signoff'], tech.user.id, '2026-02-01T00:00:00Z', '2027-02-01T00:00:00Z', CODE.replace('A', 'D'));
    const v2 = await nextDraft(manager, p.id, () => ({ changeClass: 'editorial', changeSummary: 'Spelling.' }));
    const res = await manager2.get(`/api/procedures/${p.id}/versions/${v2.id}/impact`);
    expect(res.body).toMatchObject({ asks: 'nothing', people: [] });
    expect(res.body.authorisations.map((a: { scopeCode: string; practicalsNoLongerCount: boolean }) => [a.scopeCode, a.practicalsNoLongerCount])).toEqual([['DEAD-W', false]]);
  });
});
