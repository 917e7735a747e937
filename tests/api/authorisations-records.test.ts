import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';
import { makePng } from '../fixtures/evidence-files.js';
import { makeScope, mineFor, newPerson, PERSON_PASSWORD, submitCertificate, verifyCertificate, type Person } from '../support/authorisations.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let assessor: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
let ids: Awaited<ReturnType<typeof lookups>>;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  assessor = await signIn(t, DEMO.assessor);
  proc = await publishRecordsProcedure(t);
  ids = await lookups(assessor);
});

async function signOff(tech: Person) {
  const s = (await tech.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.selfSignOff.id })).body;
  const put = (prompt: string, body: Record<string, unknown>) => tech.put(`/api/signoffs/${s.id}/items/${itemByPrompt(s, prompt).id}`).send(body);
  await put('I proved', { checked: true });
  await put('Serial number', { text: 'DIM-2291' });
  await put('Supply voltage', { value: 231, unit: 'V' });
  const photo = await tech.post('/api/evidence').field('entity', 'signoff').field('entityId', s.id).attach('file', makePng(), 'set-up.png');
  await put('Photo of the test set-up', { evidenceId: photo.body.id });
  expect((await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: PERSON_PASSWORD })).status).toBe(200);
  return s.id as string;
}

async function practical(tech: Person, outcome: 'competent' | 'not_yet_competent') {
  const p = (await assessor.post('/api/practicals').send({ technicianId: tech.id, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [], circuit: CIRCUIT })).body;
  for (const h of p.holdPoints) await assessor.post(`/api/practicals/${p.id}/hold-points/${h.stepKey}`).send({});
  const entries: [string, Record<string, unknown>][] = [
    ['The technician proved dead', { checked: true }],
    ['Firing angle', { value: 72, unit: '°', instrumentId: ids.instruments['BL70-5531'] }],
    ['Output RMS voltage', { value: 191, unit: 'V', instrumentId: ids.instruments['OW61-20417'] }],
    ['Bench RCD', { value: 24, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] }],
  ];
  for (const [prompt, entry] of entries) await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, prompt).id}`).send(entry);
  expect((await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome, comment: 'Observed the whole job at the bench.', password: DEMO_PASSWORD })).status).toBe(200);
  const ack = await assessor.post(`/api/practicals/${p.id}/acknowledge`).send({ technician: tech.email, password: PERSON_PASSWORD });
  expect(ack.status, JSON.stringify(ack.body)).toBe(200);
  return p.id as string;
}

const requirementsOf = async (tech: Person, scopeId: string) =>
  (await tech.get(`/api/eligibility/${tech.id}/${scopeId}`)).body.scopes[0].requirements as { kind: string; met: boolean; detail: string; evidence: { id: string }[] }[];

describe('practicals, sign-offs and acknowledgements as requirements', () => {
  it('when a scope needs the procedure acknowledged, its sign-off countersigned and two competent practicals, then the second competent practical\'s last signature issues it', async () => {
    const scope = await makeScope(manager, {
      title: 'Live testing of lamp dimmers behind an isolating transformer', allowsLiveWork: true, certificateGraceDays: 14,
      requirements: [
        { kind: 'procedure_ack', procedureId: proc.id },
        { kind: 'checklist_signoff', procedureId: proc.id },
        { kind: 'practicals', procedureId: proc.id, count: 2, windowMonths: 12 },
        { kind: 'certificate', certificateKind: 'first_aid_cpr' },
      ],
    });
    const tech = await newPerson(t);
    expect((await tech.post(`/api/procedures/${proc.id}/versions/${proc.versionId}/acknowledge`).send({ password: PERSON_PASSWORD })).status).toBe(201);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2028-01-05' }), DEMO_PASSWORD);
    let reqs = await requirementsOf(tech, scope.id);
    expect(reqs.map((r) => [r.kind, r.met])).toEqual([['procedure_ack', true], ['checklist_signoff', false], ['practicals', false], ['certificate', true]]);
    expect(reqs[2].detail).toBe('2 more competent practicals needed (0 of 2 since 2 Mar 2025).');

    t.clock.advance(3_600_000);
    const signoff = await signOff(tech);
    expect((await requirementsOf(tech, scope.id))[1].met, 'submitted is not yet countersigned').toBe(false);
    expect((await assessor.post(`/api/signoffs/${signoff}/countersign`).send({ password: DEMO_PASSWORD })).status).toBe(200);

    t.clock.advance(3_600_000);
    await practical(tech, 'not_yet_competent');
    const first = await practical(tech, 'competent');
    reqs = await requirementsOf(tech, scope.id);
    expect(reqs.slice(1, 3).map((r) => r.met)).toEqual([true, false]);
    expect(reqs[2].detail).toMatch(/^1 more competent practical needed \(1 of 2/);
    expect(await mineFor(tech, scope.id), 'not before the last requirement').toBeUndefined();

    t.clock.advance(86_400_000);
    const second = await practical(tech, 'competent');
    const mine = await mineFor(tech, scope.id);
    expect(mine?.state).toBe('active');
    expect(mine?.validFrom).toBe('2026-03-03');
    const detail = (await tech.get(`/api/authorisations/${mine!.id}`)).body;
    const practicalEvidence = detail.snapshot.requirements.find((r: { kind: string }) => r.kind === 'practical' || r.kind === 'practicals').evidence.map((e: { id: string }) => e.id);
    expect(practicalEvidence.sort()).toEqual([first, second].sort());
    const issued = detail.periods[0].events[0];
    const signedAt = (await t.ownerQuery(`select acknowledged_at from practicals where id = $1`, [second])).rows[0].acknowledged_at;
    expect(issued.effectiveAt).toBe(new Date(signedAt).toISOString());
  });
});

describe('a re-read version with a deadline', () => {
  it('when a re-read version is published, then what rests on the earlier acknowledgement ends at the deadline; acknowledging in time brings the full validity back, missing it lapses it', async () => {
    const { draftBody, nextDraft, publishNew, submitAndApprove } = await import('../support/procedures.js');
    const manager2 = await signIn(t, DEMO.manager2);
    const p = await publishNew(manager, manager2, draftBody({ title: 'Replacing the triac in a lamp dimmer' }));
    const scope = await makeScope(manager, { title: 'Dead work on lamp dimmers', validityMonths: 12, requirements: [{ kind: 'procedure_ack', procedureId: p.id }, { kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const [late, prompt] = [await newPerson(t), await newPerson(t)];
    t.clock.set('2026-03-10T09:00:00Z');
    for (const tech of [late, prompt]) {
      expect((await tech.post(`/api/procedures/${p.id}/versions/${p.versionId}/acknowledge`).send({ password: PERSON_PASSWORD })).status).toBe(201);
      await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
      expect((await mineFor(tech, scope.id))?.validUntil).toBe('2027-03-10');
    }
    const v2 = await nextDraft(manager, p.id, () => ({ changeClass: 're-read', changeSummary: 'Step 2: prove dead on both triac terminals to the heatsink.', rereadDays: 14 }));
    await submitAndApprove(manager, manager2, p.id, v2.id);
    await t.services.reminders.sweep();
    for (const tech of [late, prompt]) {
      const item = (await mineFor(tech, scope.id))!;
      expect(item.validUntil, 'the re-read deadline').toBe('2026-03-24');
      expect(item.renew.map((h) => h.detail).join(' ')).toMatch(/version 2 must be acknowledged by 24 Mar 2026/);
    }

    t.clock.set('2026-03-20T09:00:00Z');
    expect((await prompt.post(`/api/procedures/${p.id}/versions/${v2.id}/acknowledge`).send({ password: PERSON_PASSWORD })).status).toBe(201);
    await t.services.reminders.sweep();
    expect((await mineFor(prompt, scope.id))?.validUntil, 'back to its validity').toBe('2027-03-10');

    t.clock.set('2026-03-25T09:00:00Z');
    await t.services.reminders.sweep();
    const lapsed = (await mineFor(late, scope.id))!;
    expect(lapsed.state).toBe('lapsed');
    const last = (await manager.get(`/api/authorisations/${lapsed.id}`)).body.periods[0].events.at(-1);
    expect(last).toMatchObject({ kind: 'lapsed', effectiveAt: '2026-03-24T23:00:00.000Z' });
    expect(last.reason).toMatch(/Version 2 was to be acknowledged by 24 Mar 2026/);
    expect((await mineFor(prompt, scope.id))?.state).toBe('active');
  });

  it('when acknowledging the procedure is the last requirement, then the acknowledgement itself issues the authorisation, with no sweep', async () => {
    const { draftBody, publishNew } = await import('../support/procedures.js');
    const manager2 = await signIn(t, DEMO.manager2);
    const p = await publishNew(manager, manager2, draftBody({ title: 'Swapping the suppression capacitor on a motor controller' }));
    const scope = await makeScope(manager, { title: 'Dead work on motor controllers', validityMonths: 12, requirements: [{ kind: 'procedure_ack', procedureId: p.id }, { kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const tech = await newPerson(t);
    t.clock.set('2026-04-01T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    expect(await mineFor(tech, scope.id), 'not before the acknowledgement').toBeUndefined();
    expect((await tech.post(`/api/procedures/${p.id}/versions/${p.versionId}/acknowledge`).send({ password: PERSON_PASSWORD })).status).toBe(201);
    const issued = await mineFor(tech, scope.id);
    expect(issued?.state).toBe('active');
    expect(issued?.validUntil).toBe('2027-04-01');
  });
});
