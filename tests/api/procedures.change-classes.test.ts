import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { parseEml } from '../support/mail.js';
import { nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, tech: Agent, tech2: Agent, tech3: Agent, assessor: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, tech, tech2, tech3, assessor] = await Promise.all(
    [DEMO.manager, DEMO.manager2, DEMO.technician, DEMO.technician2, DEMO.technician3, DEMO.assessor].map((e) => signIn(t, e)),
  );
});

const acknowledge = (a: Agent, id: string, versionId: string, password = DEMO_PASSWORD) =>
  a.post(`/api/procedures/${id}/versions/${versionId}/acknowledge`).send({ password });

async function stateOf(id: string, name: string) {
  const res = await manager.get(`/api/procedures/${id}/acknowledgements`).query({ pageSize: 200 });
  return res.body.items.find((r: { name: string }) => r.name === name);
}

/** A published v1 acknowledged by Tomasz and Marcus (not by Amélie). */
async function acknowledgedProcedure() {
  const d = await publishNew(manager, manager2);
  expect((await acknowledge(tech, d.id, d.versionId)).status).toBe(201);
  expect((await acknowledge(tech3, d.id, d.versionId)).status).toBe(201);
  return d;
}

describe('change classes and acknowledgements', () => {
  it('when a technician acknowledges with a wrong password, then 422 names password and nothing is recorded', async () => {
    const d = await publishNew(manager, manager2);
    const res = await acknowledge(tech2, d.id, d.versionId, 'certainly-not-right');
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty('password');
    expect((await stateOf(d.id, 'Amélie Fournier')).state).toBe('not-acknowledged');
  });

  it('when a technician acknowledges, then the signature means "I will work to this version" and a second one is refused', async () => {
    const d = await publishNew(manager, manager2);
    const res = await acknowledge(tech2, d.id, d.versionId);
    expect(res.status).toBe(201);
    expect(res.body.acknowledgement).toMatchObject({ printedName: 'Amélie Fournier', meaning: 'I will work to this version' });
    expect((await acknowledge(tech2, d.id, d.versionId)).status).toBe(409);
    const mine = await tech2.get(`/api/procedures/${d.id}/versions/${d.versionId}`);
    expect(mine.body.myAcknowledgement.meaning).toBe('I will work to this version');
    expect((await stateOf(d.id, 'Amélie Fournier')).state).toBe('acknowledged');
  });

  it('when an editorial version is published, then nothing is asked: no mail, and earlier acknowledgements still count', async () => {
    const d = await acknowledgedProcedure();
    const v2 = await nextDraft(manager, d.id, () => ({ changeClass: 'editorial', changeSummary: 'Typing error in the scope corrected.', scope: 'Bench repair of a phase-angle lamp dimmer for 230 V, with the unit disconnected from the mains.' }));
    const impact = await manager2.get(`/api/procedures/${d.id}/versions/${v2.id}/impact`);
    expect(impact.body).toMatchObject({ changeClass: 'editorial', asks: 'nothing', people: [] });
    const mailsBefore = t.mails().length;
    await submitAndApprove(manager, manager2, d.id, v2.id);
    expect(t.mails().length).toBe(mailsBefore);
    expect((await stateOf(d.id, 'Tomasz Wójcik')).state).toBe('acknowledged');
    expect((await stateOf(d.id, 'Marcus Boateng')).state).toBe('acknowledged');
    expect((await stateOf(d.id, 'Amélie Fournier')).state).toBe('not-acknowledged');
  });

  it('when a re-read version is published, then exactly the earlier acknowledgers are previewed, mailed once each and due by the deadline', async () => {
    const d = await acknowledgedProcedure();
    const v2 = await nextDraft(manager, d.id, (v) => ({
      changeClass: 're-read', changeSummary: 'Step 3 now names the rating of the replacement triac.', rereadDays: 10,
      steps: v.steps.map((s: { text: string }, i: number) => (i === 2 ? { ...s, text: 'Desolder the triac and fit a replacement rated at least 600 V and the same current.' } : s)),
    }));
    const impact = await manager2.get(`/api/procedures/${d.id}/versions/${v2.id}/impact`);
    expect(impact.status).toBe(200);
    expect(impact.body.asks).toBe('re-read');
    expect(impact.body.people.map((p: { name: string }) => p.name)).toEqual(['Marcus Boateng', 'Tomasz Wójcik']);
    // Ten days from 2 March at each person's own site.
    expect(impact.body.people.map((p: { dueOn: string }) => p.dueOn)).toEqual(['2026-03-12', '2026-03-12']);

    const before = new Set(t.mails());
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const sent = await Promise.all(t.mails().filter((m) => !before.has(m)).map(parseEml));
    expect(sent.map((m) => m.to).sort()).toEqual([DEMO.technician, DEMO.technician3].sort());
    expect(sent[0].subject).toMatch(/^Re-read T-.* version 2 by 2026-03-12$/);
    expect(sent[0].text).toContain('acknowledge it again by 2026-03-12');

    expect(await stateOf(d.id, 'Tomasz Wójcik')).toMatchObject({ state: 're-read-due', dueOn: '2026-03-12', lastAcknowledgedNumber: 1, requestClass: 're-read' });
    expect((await stateOf(d.id, 'Amélie Fournier')).state).toBe('not-acknowledged');
    expect((await acknowledge(tech, d.id, v2.id)).status).toBe(201);
    expect((await stateOf(d.id, 'Tomasz Wójcik')).state).toBe('acknowledged');

    t.clock.advance(11 * 86_400_000);
    try {
      expect((await stateOf(d.id, 'Marcus Boateng')).state).toBe('overdue');
      const theirList = await tech3.get('/api/procedures').query({ q: d.code });
      expect(theirList.body.items[0]).toMatchObject({ myState: 'overdue', myDueOn: '2026-03-12', publishedNumber: 2 });
    } finally {
      t.clock.advance(-11 * 86_400_000);
    }
  });

  it('when a manager extends one person\'s deadline with a reason, then only theirs moves and it is audited', async () => {
    const d = await acknowledgedProcedure();
    const v2 = await nextDraft(manager, d.id, () => ({ changeClass: 're-read', changeSummary: 'PPE list updated.', ppe: ['Safety glasses', 'Insulating gloves for the proving step'] }));
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const marcus = await stateOf(d.id, 'Marcus Boateng');
    const url = `/api/procedures/${d.id}/acknowledgements/${marcus.userId}/extension`;
    const tomasz = await stateOf(d.id, 'Tomasz Wójcik');
    // Dana manages Cleveland only: Tomasz (Leipzig) is not hers to extend; Marcus (Cleveland) is.
    expect((await manager2.post(`/api/procedures/${d.id}/acknowledgements/${tomasz.userId}/extension`).send({ dueOn: '2026-04-30', reason: 'Asked by phone' })).status).toBe(403);
    expect((await manager2.post(url).send({ dueOn: '2026-03-01', reason: 'On leave' })).status).toBe(422);
    expect((await manager2.post(url).send({ dueOn: '2026-04-30' })).status).toBe(400);
    const ok = await manager2.post(url).send({ dueOn: '2026-04-30', reason: 'On leave until the middle of April.' });
    expect(ok.status).toBe(200);
    expect(await stateOf(d.id, 'Marcus Boateng')).toMatchObject({ dueOn: '2026-04-30', extensionReason: 'On leave until the middle of April.' });
    expect((await stateOf(d.id, 'Tomasz Wójcik')).dueOn).toBe('2026-03-16');
    const audit = await t.ownerQuery(`select new_values from audit_log where action = 'procedure.reread_extended' order by id desc limit 1`);
    expect(audit.rows[0].new_values).toEqual({ dueOn: '2026-04-30', reason: 'On leave until the middle of April.' });
  });

  it('when a hold point is moved, then editorial and re-read are refused at submission and re-assess goes through', async () => {
    const d = await acknowledgedProcedure();
    const v2 = await nextDraft(manager, d.id, (v) => ({
      changeClass: 're-read', changeSummary: 'Proving dead moved after a new discharge step.',
      steps: [v.steps[0], { text: 'Discharge the X2 capacitor through a 10 kΩ resistor rated for the voltage.', holdPoint: false }, v.steps[1], v.steps[2]],
    }));
    expect(v2.changeCheck.minimum).toBe('re-assess');
    expect(v2.changeCheck.reasons[0]).toMatch(/hold point at step 3 \(step 2 before\) moved/);
    const refused = await manager.post(`/api/procedures/${d.id}/versions/${v2.id}/submit`);
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields.changeClass).toMatch(/at least re-assess/);
    const fixed = await nextDraftSave(d.id, v2, { changeClass: 're-assess' });
    expect(fixed.status).toBe(200);
    const impact = await manager2.get(`/api/procedures/${d.id}/versions/${v2.id}/impact`);
    expect(impact.body.asks).toBe('re-assess');
    const before = new Set(t.mails());
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const sent = await Promise.all(t.mails().filter((m) => !before.has(m)).map(parseEml));
    expect(sent).toHaveLength(2);
    expect(sent[0].text).toContain('practicals done against earlier versions no longer count');
    expect((await stateOf(d.id, 'Marcus Boateng')).requestClass).toBe('re-assess');
  });

  it('when the person asked is an assessor, then they are asked too, and the table shows technicians and assessors', async () => {
    const d = await publishNew(manager, manager2);
    expect((await acknowledge(assessor, d.id, d.versionId)).status).toBe(201);
    const table = await manager.get(`/api/procedures/${d.id}/acknowledgements`).query({ pageSize: 200 });
    const names = table.body.items.map((r: { name: string }) => r.name);
    expect(names).toEqual(expect.arrayContaining(['Amélie Fournier', 'Marcus Boateng', 'Priya Natarajan', 'Tomasz Wójcik']));
    expect(names).not.toContain('Dana Whitcombe');
    const filtered = await manager.get(`/api/procedures/${d.id}/acknowledgements`).query({ state: 'acknowledged' });
    expect(filtered.body.items.map((r: { name: string }) => r.name)).toEqual(['Priya Natarajan']);
    const own = await tech.get(`/api/procedures/${d.id}/acknowledgements`);
    expect(own.body.items.map((r: { name: string }) => r.name)).toEqual(['Tomasz Wójcik']);
  });

  it('when a version not in force is acknowledged, then 409 (or 404 for a technician who cannot see it)', async () => {
    const d = await acknowledgedProcedure();
    const v2 = await nextDraft(manager, d.id, () => ({ changeClass: 'editorial', changeSummary: 'Wording.' }));
    expect((await acknowledge(tech, d.id, v2.id)).status).toBe(404);
    expect((await acknowledge(assessor, d.id, v2.id)).status).toBe(404);
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const old = await acknowledge(tech2, d.id, d.versionId);
    expect(old.status).toBe(404);
  });
});

async function nextDraftSave(id: string, v: any, patch: Record<string, unknown>) {
  const body = {
    title: v.title, category: v.category, reviewPeriodMonths: v.reviewPeriodMonths, scope: v.scope, hazards: v.hazards, ppe: v.ppe, equipment: v.equipment,
    steps: v.steps, checklists: v.checklists, changeSummary: v.changeSummary, changeClass: v.changeClass, rereadDays: v.rereadDays, ...patch,
  };
  return manager.put(`/api/procedures/${id}/versions/${v.id}`).send(body);
}
