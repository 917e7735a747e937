import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';
import { calculateTrigger } from '../../shared/engine/calculators.js';
import { triggerInputSchema } from '../../shared/schemas/engine.js';

// The clock starts at 2026-03-02T09:00Z: the demo's LEJ-B1 is in date, LEJ-B2's inspection fell due 30 days before.
let t: TestApp;
let assessor: Awaited<ReturnType<typeof signIn>>;
let tech: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
let ids: Awaited<ReturnType<typeof lookups>>;
const meter = () => ids.instruments['OW61-20417'];

beforeAll(async () => {
  t = await makeTestApp();
  assessor = await signIn(t, DEMO.assessor);
  tech = await signIn(t, DEMO.technician);
  proc = await publishRecordsProcedure(t);
  ids = await lookups(assessor);
});

const openBody = (over: Record<string, unknown> = {}) => ({
  technicianId: tech.user.id, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [meter()], circuit: CIRCUIT, ...over,
});
async function openPractical(over: Record<string, unknown> = {}) {
  const res = await assessor.post('/api/practicals').send(openBody(over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}
const measure = (p: { id: string }, itemId: string, body: Record<string, unknown>) => assessor.put(`/api/practicals/${p.id}/items/${itemId}`).send(body);
const witness = (p: { id: string }, stepKey: string) => assessor.post(`/api/practicals/${p.id}/hold-points/${stepKey}`).send({});

describe('a supervised practical through the API', () => {
  it('when opened on the good bench, then the engine’s expected values are stored and shown beside each measurement item', async () => {
    const p = await openPractical();
    const engine = calculateTrigger(triggerInputSchema.parse({
      supply: { voltageRms: 230, frequencyHz: 50 }, loadOhms: 529, fixedResistanceOhms: 3300, potentiometerOhms: 470_000, setting: 0.3, capacitanceF: 100e-9,
      diac: { breakoverV: 32, breakbackV: 6 }, device: { latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1 },
    }));
    // The time-domain simulation is the authority for the firing angle; the supply is the bench's own 230 V 50 Hz.
    expect(p.expectations.supply).toEqual({ voltageRms: 230, frequencyHz: 50 });
    expect(p.expectations.firing.angleDeg).toBe(engine.expectedFiringAngleDeg);
    const alpha = (p.expectations.firing.angleDeg * Math.PI) / 180;
    // V·√(1 − α/π + sin 2α / 2π) for a resistive load (Rashid, Power Electronics, 4th ed., single-phase AC voltage controller; from memory).
    const vout = 230 * Math.sqrt(1 - alpha / Math.PI + Math.sin(2 * alpha) / (2 * Math.PI));
    expect(p.expectations.quantities['output-rms-voltage']).toBeCloseTo(vout, 9);
    expect(p.expectations.quantities['load-power']).toBeCloseTo((vout * vout) / 529, 9);
    const volts = itemByPrompt(p, 'Output RMS voltage');
    expect(volts.expected).toBeCloseTo(vout, 9);
    expect(volts.tolerance).toBe(`± 5 % (± ${Number(((vout * 5) / 100).toPrecision(4))} V)`);
    expect(itemByPrompt(p, 'Firing angle').tolerance).toBe('± 5 °');
    expect(p.holdPoints.map((h: { number: number; witnessed: unknown }) => [h.number, h.witnessed])).toEqual([[1, null], [2, null], [3, null]]);
    expect(p.expectations.thermal.junctionC).toBeGreaterThan(25);
  });

  it('when measurements are recorded, then each is stored with unit, expected value, tolerance, verdict and instrument, and one out of tolerance is failed', async () => {
    const p = await openPractical();
    const expected = itemByPrompt(p, 'Output RMS voltage').expected as number;
    const low = await measure(p, itemByPrompt(p, 'Output RMS voltage').id, { value: Math.round(expected * 0.9), unit: 'V', instrumentId: meter() });
    expect(low.status, JSON.stringify(low.body)).toBe(200);
    const volts = itemByPrompt(low.body, 'Output RMS voltage');
    expect(volts.entry).toMatchObject({ value: Math.round(expected * 0.9), unit: 'V', verdict: 'fail', judgedBy: 'rule', instrument: { id: meter(), label: 'Ohmwerk DM 61 SN OW61-20417' } });
    expect(volts.entry.expected).toBeCloseTo(expected, 9);
    expect(volts.entry.tolerance).toMatch(/^± 5 %/);
    expect(volts.problem).toBe('the reading is outside the acceptance rule');
    const angle = itemByPrompt(p, 'Firing angle');
    const ok = await measure(p, angle.id, { value: (angle.expected as number) + 3, unit: '°', instrumentId: ids.instruments['BL70-5531'] });
    expect(itemByPrompt(ok.body, 'Firing angle').entry).toMatchObject({ verdict: 'pass', tolerance: '± 5 °' });
    // The preset rule names its standard beside the verdict.
    const rcd = await measure(p, itemByPrompt(p, 'Bench RCD').id, { value: 310, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] });
    expect(itemByPrompt(rcd.body, 'Bench RCD').entry).toMatchObject({ verdict: 'fail', ruleText: '≤ 300 ms', source: { standard: 'IEC 61008-1 (RCCB) / IEC 61009-1 (RCBO)' } });
    const stored = await t.ownerQuery('select value, unit, expected, tolerance, verdict, instrument_id from practical_entries where practical_id = $1 and verdict = $2', [p.id, 'fail']);
    expect(stored.rows).toHaveLength(2);
    expect(rcd.body.instruments.map((i: { id: string }) => i.id)).toEqual(expect.arrayContaining([meter(), ids.instruments['TF3-11902']]));
  });

  it('when an entry is incomplete or in the wrong unit, then 422 names the field and nothing is stored', async () => {
    const p = await openPractical();
    const volts = itemByPrompt(p, 'Output RMS voltage').id;
    expect((await measure(p, volts, { value: 190, unit: 'mV', instrumentId: meter() })).body.error.fields).toEqual({ unit: 'this item is measured in V, not mV' });
    expect((await measure(p, volts, { value: 190, unit: 'V' })).body.error.fields).toHaveProperty('instrumentId');
    expect((await measure(p, volts, { value: 'did-not-trip', unit: 'V', instrumentId: meter() })).status).toBe(422);
    expect((await measure(p, volts, { value: 190, unit: 'V', instrumentId: meter(), assessorVerdict: 'pass' })).body.error.fields).toHaveProperty('assessorVerdict');
    expect((await t.ownerQuery('select count(*)::int as n from practical_entries where practical_id = $1', [p.id])).rows[0].n).toBe(0);
  });

  it('when a hold point is witnessed before an earlier one, then 409 names the earlier one; in order they are accepted', async () => {
    const p = await openPractical();
    const [first, second] = p.holdPoints;
    const skipped = await witness(p, second.stepKey);
    expect(skipped.status).toBe(409);
    expect(skipped.body.error.message).toContain('Hold point 1 comes first');
    expect(skipped.body.error.fields.stepKey).toContain('Press the RCD test button');
    // The database keeps the order too, whatever the code does.
    await expect(t.deps.pool.query('insert into practical_hold_points (practical_id, step_key, position, witnessed_at, witnessed_by) values ($1, $2, $3, now(), $4)', [p.id, second.stepKey, second.position, assessor.user.id])).rejects.toThrow(/earlier hold point/);
    expect((await witness(p, first.stepKey)).status).toBe(200);
    expect((await witness(p, first.stepKey)).status).toBe(409);
    const done = await witness(p, second.stepKey);
    expect(done.body.holdPoints.map((h: { witnessed: unknown }) => h.witnessed !== null)).toEqual([true, true, false]);
    const third = p.holdPoints[2];
    await expect(t.deps.pool.query('insert into practical_hold_points (practical_id, step_key, position, witnessed_at, witnessed_by) values ($1, $2, $3, now(), $4)', [p.id, third.stepKey, third.position - 1, assessor.user.id])).rejects.toThrow(/not a hold point/);
  });

  it('when the whole practical is recorded and signed by both, then the outcome is competent and the technician signed with their own password', async () => {
    const p = await openPractical();
    for (const h of p.holdPoints) expect((await witness(p, h.stepKey)).status).toBe(200);
    await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, 'The technician proved dead').id}`).send({ checked: true });
    await measure(p, itemByPrompt(p, 'Firing angle').id, { value: 74, unit: '°', instrumentId: ids.instruments['BL70-5531'] });
    await measure(p, itemByPrompt(p, 'Output RMS voltage').id, { value: 188, unit: 'V', instrumentId: meter() });
    const last = await measure(p, itemByPrompt(p, 'Bench RCD').id, { value: 22, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] });
    expect(last.body.progress).toEqual({ done: 4, total: 4 });
    const bad = await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'competent', comment: 'Safe and methodical.', password: 'not-my-password' });
    expect(bad.status).toBe(422);
    const signed = await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'competent', comment: 'Safe and methodical.', password: DEMO_PASSWORD });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    expect(signed.body).toMatchObject({ status: 'assessed', outcome: 'competent', signatures: [{ printedName: 'Priya Natarajan', meaning: 'assessed' }] });
    const wrong = await assessor.post(`/api/practicals/${p.id}/acknowledge`).send({ technician: DEMO.technician2, password: DEMO_PASSWORD });
    expect(wrong.status).toBe(403);
    // Named by id in another letter case: the same person (ids are parsed to one spelling).
    const ack = await assessor.post(`/api/practicals/${p.id}/acknowledge`).send({ technician: tech.user.id.toUpperCase(), password: DEMO_PASSWORD });
    expect(ack.status, JSON.stringify(ack.body)).toBe(200);
    expect(ack.body.status).toBe('acknowledged');
    expect(ack.body.signatures.map((s: { printedName: string; meaning: string }) => [s.printedName, s.meaning])).toEqual([['Priya Natarajan', 'assessed'], ['Tomasz Wójcik', 'outcome acknowledged']]);
    // The assessor is still signed in on the device.
    expect((await assessor.get('/api/session')).body.email).toBe(DEMO.assessor);
    const mine = (await tech.get('/api/practicals').query({ view: 'mine', status: 'acknowledged' })).body;
    expect(mine.items.map((r: { id: string }) => r.id)).toContain(p.id);
  });

  it('when a failed measurement stands, then competent is refused naming it, and not yet competent can be signed', async () => {
    const p = await openPractical();
    await measure(p, itemByPrompt(p, 'Output RMS voltage').id, { value: 150, unit: 'V', instrumentId: meter() });
    const refused = await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'competent', comment: 'Looked fine.', password: DEMO_PASSWORD });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields[`items.${itemByPrompt(p, 'Output RMS voltage').id}`]).toBe('3. Output RMS voltage: the reading is outside the acceptance rule');
    expect(refused.body.error.fields[`holdPoints.${p.holdPoints[0].stepKey}`]).toContain('not witnessed');
    const nyc = await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'not_yet_competent', comment: 'Output far below the expected value; set-up not checked.', password: DEMO_PASSWORD });
    expect(nyc.body).toMatchObject({ status: 'assessed', outcome: 'not_yet_competent' });
  });

  it('when practicals are listed for the site, then the server pages and filters them; a manager of another site sees none', async () => {
    // Filtered to this file's procedure: the demo seed has practicals of its own.
    const manager = await signIn(t, DEMO.manager);
    const all = (await manager.get('/api/practicals').query({ view: 'site', pageSize: 100, q: proc.version.code })).body;
    expect(all.total).toBeGreaterThanOrEqual(6);
    const page = (await manager.get('/api/practicals').query({ view: 'site', pageSize: 2, page: 2, q: proc.version.code })).body;
    expect(page).toMatchObject({ total: all.total, page: 2, pageSize: 2 });
    expect(page.items).toHaveLength(2);
    const nyc = (await manager.get('/api/practicals').query({ view: 'site', outcome: 'not_yet_competent', q: proc.version.code })).body;
    expect(nyc.items.map((r: { outcome: string; failed: number }) => [r.outcome, r.failed])).toEqual([['not_yet_competent', 1]]);
    const manager2 = await signIn(t, DEMO.manager2);
    expect((await manager2.get('/api/practicals').query({ view: 'site', q: proc.version.code })).body.total).toBe(0);
    expect((await tech.get('/api/practicals').query({ view: 'site', pageSize: 100, q: proc.version.code })).body.total).toBe(all.total);
  });
});
