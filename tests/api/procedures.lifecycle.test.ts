import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { createDraft, draftBody, nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let manager2: Awaited<ReturnType<typeof signIn>>;
let tech: Awaited<ReturnType<typeof signIn>>;
let auditor: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, tech, auditor] = await Promise.all([signIn(t, DEMO.manager), signIn(t, DEMO.manager2), signIn(t, DEMO.technician), signIn(t, DEMO.auditor)]);
});

const auditActions = async (entityId: string) =>
  (await t.ownerQuery('select action from audit_log where entity_id = $1 order by id', [entityId])).rows.map((r) => r.action);

describe('procedure lifecycle', () => {
  it('when a manager creates, saves, submits and another approves, then the version is published with a signed approval', async () => {
    const d = await createDraft(manager);
    expect(d.version.status).toBe('draft');
    expect(d.version.steps).toHaveLength(3);
    expect(d.version.steps[1]).toMatchObject({ holdPoint: true, caution: 'A lamp dimmer can hold charge in its X2 capacitor.' });
    expect(d.version.checklists[0].items.map((i: { kind: string }) => i.kind)).toEqual(['tick', 'text', 'evidence', 'measurement', 'measurement', 'measurement']);
    expect(d.version.checklists[0].items[3].ruleText).toMatch(/In-service equipment insulation resistance: Class I.*IET Code of Practice/);

    const published = await submitAndApprove(manager, manager2, d.id, d.versionId);
    expect(published.status).toBe('published');
    expect(published.inForce).toBe(true);
    expect(published.approval).toMatchObject({ printedName: 'Dana Whitcombe', meaning: 'approved for use', signedAt: t.clock.now().toISOString() });
    // Reviewed 12 months after publication, dated at the owning site (Leipzig).
    expect(published.reviewDueOn).toBe('2027-03-02');
    expect(await auditActions(d.versionId)).toEqual(['procedure.draft_saved', 'procedure.submitted', 'signature.made', 'procedure.published']);
  });

  it('when the author tries to approve their own draft, then it is refused and stays in review', async () => {
    const d = await createDraft(manager);
    expect((await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`)).status).toBe(200);
    const res = await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/approve`).send({ password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/another manager/);
    expect((await manager.get(`/api/procedures/${d.id}/versions/${d.versionId}`)).body.status).toBe('in_review');
  });

  it('when a second manager edited the draft, then they may not approve it either', async () => {
    const d = await createDraft(manager);
    expect((await manager2.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody({ scope: 'Edited by the second manager.' }))).status).toBe(200);
    await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`);
    const res = await manager2.post(`/api/procedures/${d.id}/versions/${d.versionId}/approve`).send({ password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
  });

  it('when the approver gives a wrong password, then 422 names password and nothing changes', async () => {
    const d = await createDraft(manager);
    await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`);
    const before = await auditActions(d.versionId);
    const sigsBefore = (await t.ownerQuery('select count(*)::int as n from signatures')).rows[0].n;
    const res = await manager2.post(`/api/procedures/${d.id}/versions/${d.versionId}/approve`).send({ password: 'not-my-password-at-all' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty('password');
    const after = await manager.get(`/api/procedures/${d.id}/versions/${d.versionId}`);
    expect(after.body.status).toBe('in_review');
    expect(after.body.approval).toBeNull();
    expect(await auditActions(d.versionId)).toEqual(before);
    expect((await t.ownerQuery('select count(*)::int as n from signatures')).rows[0].n).toBe(sigsBefore);
  });

  it('when a published version is edited, then 409 and its content is unchanged', async () => {
    const d = await publishNew(manager, manager2);
    const res = await manager.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody({ scope: 'Sneaky change.' }));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/never changes; start a new draft/);
    expect((await manager.get(`/api/procedures/${d.id}/versions/${d.versionId}`)).body.scope).toBe(draftBody().scope);
  });

  it('when a version is in review, then it cannot be edited until it is returned with comments', async () => {
    const d = await createDraft(manager);
    await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`);
    expect((await manager.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody())).status).toBe(409);
    const returned = await manager2.post(`/api/procedures/${d.id}/versions/${d.versionId}/return`).send({ comment: 'Name the tester category.' });
    expect(returned.status).toBe(200);
    expect(returned.body).toMatchObject({ status: 'draft', returned: { byName: 'Dana Whitcombe', comment: 'Name the tester category.' } });
    expect((await manager.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody())).status).toBe(200);
  });

  it('when transitions are asked out of order, then each is refused with 409 and the status stays', async () => {
    const d = await createDraft(manager);
    const at = (s: string) => `/api/procedures/${d.id}/versions/${d.versionId}/${s}`;
    expect((await manager2.post(at('approve')).send({ password: DEMO_PASSWORD })).status).toBe(409);
    expect((await manager2.post(at('return')).send({ comment: 'too early' })).status).toBe(409);
    expect((await manager.post(at('withdraw')).send({ reason: 'not yet published' })).status).toBe(409);
    await manager.post(at('submit'));
    expect((await manager.post(at('submit'))).status).toBe(409);
    expect((await manager.post(at('withdraw')).send({ reason: 'in review' })).status).toBe(409);
    await manager2.post(at('approve')).send({ password: DEMO_PASSWORD });
    expect((await manager2.post(at('approve')).send({ password: DEMO_PASSWORD })).status).toBe(409);
    expect((await manager.post(at('submit'))).status).toBe(409);
    expect((await manager2.post(at('return')).send({ comment: 'after publication' })).status).toBe(409);
    expect((await manager.get(at('').slice(0, -1))).body.status).toBe('published');
  });

  it('when a draft is incomplete, then submission names every missing field and changes nothing', async () => {
    const created = await manager.post('/api/procedures').send({ code: 'T-EMPTY-1', title: 'Empty one', category: 'general', reviewPeriodMonths: 24 });
    const res = await manager.post(`/api/procedures/${created.body.procedureId}/versions/${created.body.id}/submit`);
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['checklists', 'hazards', 'scope', 'steps']);
    expect((await manager.get(`/api/procedures/${created.body.procedureId}/versions/${created.body.id}`)).body.status).toBe('draft');
  });

  it('when a new version is published, then the old one is superseded, still readable and marked not in force', async () => {
    const d = await publishNew(manager, manager2);
    const v2 = await nextDraft(manager, d.id, () => ({ changeClass: 'editorial', changeSummary: 'Wording of step 1 made plainer.' }));
    expect(v2.number).toBe(2);
    expect((await manager.post(`/api/procedures/${d.id}/versions`)).status).toBe(409);
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const old = await tech.get(`/api/procedures/${d.id}/versions/${d.versionId}`);
    // Technicians work to the version in force only.
    expect(old.status).toBe(404);
    const asAuditor = await auditor.get(`/api/procedures/${d.id}/versions/${d.versionId}`);
    expect(asAuditor.body).toMatchObject({ status: 'superseded', inForce: false });
    const history = await auditor.get(`/api/procedures/${d.id}`);
    expect(history.body.versions.map((v: { number: number; status: string }) => `${v.number}:${v.status}`)).toEqual(['2:published', '1:superseded']);
    expect(history.body.versions[0]).toMatchObject({ authorName: 'Jörg Łukasik', approverName: 'Dana Whitcombe', changeSummary: 'Wording of step 1 made plainer.' });
  });

  it('when a published version is withdrawn with a reason, then nothing is in force and the reason is kept', async () => {
    const d = await publishNew(manager, manager2);
    expect((await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/withdraw`).send({ reason: '' })).status).toBe(400);
    const res = await manager.post(`/api/procedures/${d.id}/versions/${d.versionId}/withdraw`).send({ reason: 'The bench it covers was scrapped.' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'withdrawn', inForce: false, withdrawn: { byName: 'Jörg Łukasik', reason: 'The bench it covers was scrapped.' } });
    expect((await manager.get(`/api/procedures/${d.id}`)).body.inForce).toBeNull();
    expect(await auditActions(d.versionId)).toContain('procedure.withdrawn');
  });

  it('when the code is taken or the body is bad, then 409 or 400 name the field', async () => {
    const d = await createDraft(manager);
    const dup = await manager.post('/api/procedures').send({ code: d.code, title: 'Again', category: 'general', reviewPeriodMonths: 12 });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields).toEqual({ code: 'already in use' });
    const bad = await manager.post('/api/procedures').send({ code: 'x', title: '', category: 'nonsense', reviewPeriodMonths: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['category', 'code', 'reviewPeriodMonths', 'title']);
    const rule = await manager.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody({
      checklists: [{ kind: 'self-sign-off', title: 'Bad rule', items: [{ kind: 'measurement', prompt: 'RCD trip time', unit: 'V', rule: { type: 'preset', presetId: 'rcd-30ma-1x' } }] }],
    }));
    expect(rule.status).toBe(400);
    expect(rule.body.error.fields).toEqual({ 'checklists.0.items.0.unit': 'this rule is in ms' });
  });

  it('when a self sign-off or bench pre-use checklist is given a computed-value rule, then 422 names the rule and the draft is unchanged', async () => {
    const d = await createDraft(manager);
    const before = (await manager.get(`/api/procedures/${d.id}/versions/${d.versionId}`)).body;
    const computed = { kind: 'measurement', prompt: 'Output RMS voltage at the mid setting', unit: 'V', rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 8 } } } as const;
    const tick = { kind: 'tick', prompt: 'Clips secure' } as const;
    for (const kind of ['self-sign-off', 'bench-pre-use'] as const) {
      const res = await manager.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody({
        checklists: [{ kind: 'practical-assessment', title: 'Assessor', items: [computed] }, { kind, title: 'Mine', items: [tick, tick, computed] }],
      }));
      expect(res.status).toBe(422);
      expect(res.body.error.fields).toEqual({ 'checklists.1.items.2.rule': 'a computed value needs the circuit under test, which only a practical has; use a fixed range or a published limit, or leave it to the assessor' });
    }
    const after = (await manager.get(`/api/procedures/${d.id}/versions/${d.versionId}`)).body;
    expect(after.checklists).toEqual(before.checklists);
    expect(await auditActions(d.versionId)).toEqual(['procedure.draft_saved']);
    // The same rule on a practical assessment is what practicals judge against.
    const ok = await manager.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody({ checklists: [{ kind: 'practical-assessment', title: 'Assessor', items: [computed] }] }));
    expect(ok.status).toBe(200);
  });

  it('when an auditor or technician tries to write, then 403', async () => {
    const d = await createDraft(manager);
    expect((await auditor.post('/api/procedures').send({ code: 'T-AUD-1', title: 'No', category: 'general', reviewPeriodMonths: 12 })).status).toBe(403);
    expect((await auditor.put(`/api/procedures/${d.id}/versions/${d.versionId}`).send(draftBody())).status).toBe(403);
    expect((await tech.post(`/api/procedures/${d.id}/versions/${d.versionId}/submit`)).status).toBe(403);
  });
});
