import { describe, it, expect, beforeAll } from 'vitest';
import JSZip from 'jszip';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';

let t: TestApp;
let assessor: Awaited<ReturnType<typeof signIn>>;
let tech: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
let ids: Awaited<ReturnType<typeof lookups>>;
let p: { id: string; items: any[] };
let good: number;
const meter = () => ids.instruments['OW61-20417'];
const volts = (body: Record<string, unknown>) => assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, 'Output RMS voltage').id}`).send({ unit: 'V', instrumentId: meter(), ...body });
const count = async (sql: string) => (await t.ownerQuery(sql, [p.id])).rows[0].n as number;

beforeAll(async () => {
  t = await makeTestApp();
  assessor = await signIn(t, DEMO.assessor);
  tech = await signIn(t, DEMO.technician);
  proc = await publishRecordsProcedure(t);
  ids = await lookups(assessor);
  const opened = await assessor.post('/api/practicals').send({ technicianId: tech.user.id, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [meter()], circuit: CIRCUIT });
  expect(opened.status, JSON.stringify(opened.body)).toBe(201);
  p = opened.body;
  good = Math.round(itemByPrompt(p, 'Output RMS voltage').expected as number * 10) / 10;
  expect((await volts({ value: 150 })).status).toBe(200);
});

describe('every attempt at a reading stays in the record', () => {
  it('when a reading is taken again without a reason, then 422 names reason and nothing changes', async () => {
    const audits = await count('select count(*)::int as n from audit_log where entity_id = $1');
    const refused = await volts({ value: good });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields.reason).toBe('this item already has a reading (150 V, failed); say why it is taken again');
    expect(itemByPrompt((await assessor.get(`/api/practicals/${p.id}`)).body, 'Output RMS voltage').entry).toMatchObject({ value: 150, verdict: 'fail' });
    expect(await count('select count(*)::int as n from practical_attempts where practical_id = $1')).toBe(1);
    const tick = await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, 'The technician proved dead').id}`).send({ checked: true, reason: 'Ticked again.' });
    expect(tick.body.error.fields).toEqual({ reason: 'only a reading of a practical taken again carries a reason' });
    expect(await count('select count(*)::int as n from audit_log where entity_id = $1')).toBe(audits);
  });

  it('when it is taken again with a reason, then both attempts show in order with their verdicts, and the list and the person’s record keep the failure', async () => {
    const res = await volts({ value: good, reason: 'Potentiometer was off the mid mark; reset and measured again.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const item = itemByPrompt(res.body, 'Output RMS voltage');
    expect(item.entry).toMatchObject({ value: good, verdict: 'pass' });
    expect(item.attempts!.map((a: any) => [a.seq, a.value, a.unit, a.instrument, a.verdict, a.reason])).toEqual([
      [1, 150, 'V', 'Ohmwerk DM 61 SN OW61-20417', 'fail', null],
      [2, good, 'V', 'Ohmwerk DM 61 SN OW61-20417', 'pass', 'Potentiometer was off the mid mark; reset and measured again.'],
    ]);
    expect(item.attempts!.every((a: any) => a.recordedByName === 'Priya Natarajan' && a.recordedAt)).toBe(true);
    const row = (await assessor.get('/api/practicals').query({ view: 'site', q: proc.version.code })).body.items.find((r: { id: string }) => r.id === p.id);
    expect(row).toMatchObject({ failed: 0, failedAttempts: 1 });
    const record = (await (await signIn(t, DEMO.manager)).get(`/api/people/${tech.user.id}/record`)).body;
    const readings = record.practicals.find((r: { id: string }) => r.id === p.id).readings;
    expect(readings.map((a: any) => [a.prompt, a.value, a.unit, a.instrument, a.verdict, a.reason])).toEqual([
      ['Output RMS voltage', 150, 'V', 'Ohmwerk DM 61 SN OW61-20417', 'fail', null],
      ['Output RMS voltage', good, 'V', 'Ohmwerk DM 61 SN OW61-20417', 'pass', 'Potentiometer was off the mid mark; reset and measured again.'],
    ]);
    // The database keeps attempts: the application's login may not change or remove one.
    await expect(t.deps.pool.query('update practical_attempts set verdict = $1 where practical_id = $2', ['pass', p.id])).rejects.toThrow(/permission denied/);
    await expect(t.deps.pool.query('delete from practical_attempts where practical_id = $1', [p.id])).rejects.toThrow(/permission denied/);
  });

  it('when an incident pack is made afterwards, then its text lists the failed attempt and the one taken again', async () => {
    const auditor = await signIn(t, DEMO.auditor);
    t.clock.set(new Date(t.clock.now().getTime() + 60_000).toISOString());
    const res = await asBytes(auditor.post('/api/incident-packs').send({ personId: tech.user.id, at: t.clock.now().toISOString() }));
    expect(res.status).toBe(200);
    const zip = await JSZip.loadAsync(res.body as Buffer);
    const parser = new PDFParse({ data: new Uint8Array(await zip.file('incident-pack.pdf')!.async('uint8array')) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toMatch(/Output RMS voltage: #1 150 V with Ohmwerk DM 61 SN OW61-20417 at .+ by Priya Natarajan: failed/);
    expect(text).toContain(`#2 ${good} V with Ohmwerk DM 61 SN OW61-20417`);
    expect(text).toContain('taken again because: Potentiometer was off the mid mark; reset and measured again.');
  });
});
