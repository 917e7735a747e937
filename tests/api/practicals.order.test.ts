import { randomUUID } from 'node:crypto';
import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';
import { linkedProcedure } from '../support/linked-procedure.js';
import { publishNew, nextDraft } from '../support/procedures.js';

let t: TestApp;
let assessor: Awaited<ReturnType<typeof signIn>>;
let author: Awaited<ReturnType<typeof signIn>>;
let ids: Awaited<ReturnType<typeof lookups>>;
let linked: { id: string; versionId: string };
const { keys, draft: linkedDraft } = linkedProcedure();

beforeAll(async () => {
  t = await makeTestApp();
  assessor = await signIn(t, DEMO.assessor);
  author = await signIn(t, DEMO.manager);
  ids = await lookups(assessor);
  linked = await publishNew(author, await signIn(t, DEMO.manager2), linkedDraft());
});

async function openOn(procedureId: string, versionId: string) {
  const tech = await signIn(t, DEMO.technician);
  const res = await assessor.post('/api/practicals').send({ technicianId: tech.user.id, benchId: ids.benches['LEJ-B1'], procedureId, versionId, instrumentIds: [ids.instruments['OW61-20417']], circuit: CIRCUIT });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}
const volts = (p: { id: string; items: any[] }) => assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, 'Output RMS voltage').id}`).send({ value: 188, unit: 'V', instrumentId: ids.instruments['OW61-20417'] });
const count = async (sql: string, id: string) => (await t.ownerQuery(sql, [id])).rows[0].n as number;

describe('hold points hold at the bench', () => {
  it('when a reading of step 3 is recorded before hold point 1 is witnessed, then 409 names the hold point and nothing is written', async () => {
    const p = await openOn(linked.id, linked.versionId);
    const audits = await count(`select count(*)::int as n from audit_log where entity_id = $1`, p.id);
    const refused = await volts(p);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toContain('hold point 1 (step 2: "Connections checked before switch-on.") is not witnessed yet');
    expect(refused.body.error.fields.itemId).toContain('hold point 1');
    expect(await count('select count(*)::int as n from practical_entries where practical_id = $1', p.id)).toBe(0);
    expect(await count(`select count(*)::int as n from audit_log where entity_id = $1`, p.id)).toBe(audits);
  });

  it('when the work is done in order, then each item is accepted and the record numbers what was done in that order', async () => {
    const p = await openOn(linked.id, linked.versionId);
    // An item of the hold point's own step is recorded before the hold point is witnessed.
    const rcd = await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, 'Bench RCD').id}`).send({ value: 22, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] });
    expect(rcd.status, JSON.stringify(rcd.body)).toBe(200);
    expect((await assessor.post(`/api/practicals/${p.id}/hold-points/${keys.check}`).send({})).status).toBe(200);
    const done = await volts(p);
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect(itemByPrompt(done.body, 'Bench RCD').entry.seq).toBe(1);
    expect(done.body.holdPoints[0].witnessed.seq).toBe(2);
    expect(itemByPrompt(done.body, 'Output RMS voltage').entry.seq).toBe(3);
    expect(done.body.steps.map((s: { number: number; current: boolean }) => [s.number, s.current])).toEqual([[1, true], [2, false], [3, false], [4, false]]);
  });

  it('when a version has no links, then readings are recorded in any order as before', async () => {
    const plain = await publishRecordsProcedure(t);
    const p = await openOn(plain.id, plain.versionId);
    const res = await volts(p);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(itemByPrompt(res.body, 'Output RMS voltage').entry.seq).toBe(1);
  });

  it('when a draft links an item to a step it does not have, then 422 names the item’s stepKey; links are carried into the next version', async () => {
    const draft = await nextDraft(author, linked.id, () => ({}));
    expect(draft.checklists[1].items.map((i: { stepKey: string | null }) => i.stepKey)).toEqual([keys.connect, keys.measure, keys.measure, keys.check]);
    const body = { ...linkedDraft(), changeClass: 'editorial', changeSummary: 'Wording.' };
    body.checklists[1].items[0].stepKey = randomUUID();
    const bad = await author.put(`/api/procedures/${linked.id}/versions/${draft.id}`).send(body);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toEqual({ 'checklists.1.items.0.stepKey': 'not a step of this version; choose one of its steps' });
    const kept = (await author.get(`/api/procedures/${linked.id}/versions/${draft.id}`)).body;
    expect(kept.checklists[1].items[0].stepKey).toBe(keys.connect);
  });
});
