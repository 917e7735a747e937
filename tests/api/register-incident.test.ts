import { describe, it, expect, beforeAll } from 'vitest';
import JSZip from 'jszip';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { PERSON_PASSWORD, makeScope, mineFor, newPerson, submitCertificate, verifyCertificate, type Person } from '../support/authorisations.js';
import { nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';
import { makePng } from '../fixtures/evidence-files.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let auditor: Awaited<ReturnType<typeof signIn>>;
let tech: Person;
let proc: { id: string; code: string };
let bench: { id: string };
let checkPhoto: Buffer;
const MOMENT = '2026-03-10T12:00:00Z';

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  auditor = await signIn(t, DEMO.auditor);
  const manager2 = await signIn(t, DEMO.manager2);
  t.clock.set('2026-03-02T10:00:00Z');
  const p = await publishNew(manager, manager2, { title: 'Live fault-finding on a triac dimmer' });
  proc = { id: p.id, code: p.code };
  const scope = await makeScope(manager, { allowsLiveWork: true, requirements: [{ kind: 'procedure_ack', procedureId: p.id }, { kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
  tech = await newPerson(t, { name: 'Halina Wróbel' });
  expect((await tech.post(`/api/procedures/${p.id}/versions/${p.versionId}/acknowledge`).send({ password: PERSON_PASSWORD })).status).toBe(201);
  const scan = await tech.post('/api/evidence').attach('file', makePng(5, 5), { filename: 'cpr-card.png', contentType: 'image/png' });
  await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05', evidenceId: scan.body.id } as never), DEMO_PASSWORD);
  expect((await mineFor(tech, scope.id))!.state).toBe('active');

  bench = (await manager.get('/api/benches').query({ q: 'LEJ-B1' })).body.items[0];
  t.clock.set('2026-03-03T07:30:00Z');
  const check = await tech.post(`/api/benches/${bench.id}/pre-use-checks`).send({ passed: true, notes: null, password: PERSON_PASSWORD });
  expect(check.status).toBe(201);
  checkPhoto = makePng(7, 3);
  expect((await tech.post('/api/evidence').field('entity', 'bench_check').field('entityId', check.body.id).attach('file', checkPhoto, { filename: 'rcd-test.png', contentType: 'image/png' })).status).toBe(201);

  // After the moment: a new version, a changed bench, a recalibrated tester, a failed check, a suspension.
  t.clock.set('2026-03-12T09:00:00Z');
  const v2 = await nextDraft(manager, p.id, (v) => ({
    changeClass: 're-read', changeSummary: 'Differential probe named for every scope measurement.', rereadDays: 1,
    steps: v.steps.map((s: { text: string }, i: number) => (i === 2 ? { ...s, text: 'Measure the phase-cut output with the differential probe only.' } : s)),
  }));
  await submitAndApprove(manager, manager2, p.id, v2.id);
  t.clock.set('2026-03-15T09:00:00Z');
  expect((await manager.patch(`/api/benches/${bench.id}`).send({ rcdRatedResidualMa: 100 })).status).toBe(200);
  const tester = (await manager.get('/api/instruments').query({ q: 'TF3-11902' })).body.items[0];
  expect((await manager.patch(`/api/instruments/${tester.id}`).send({ calibrationDueOn: '2027-03-01' })).status).toBe(200);
  expect((await tech.post(`/api/benches/${bench.id}/pre-use-checks`).send({ passed: false, notes: 'RCD did not trip on test button', password: PERSON_PASSWORD })).status).toBe(201);
  t.clock.set('2026-03-20T09:00:00Z');
});

async function pack(body: Record<string, unknown>) {
  return asBytes(auditor.post('/api/incident-packs').send(body));
}

describe('the incident pack', () => {
  it('when made for a known moment, then the PDF holds exactly what stood then, not today’s versions, set-up or calibration', async () => {
    const res = await pack({ personId: tech.id, at: MOMENT, benchId: bench.id, note: 'Shock reported at bench LEJ-B1' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    const zip = await JSZip.loadAsync(res.body as Buffer);
    const parser = new PDFParse({ data: new Uint8Array(await zip.file('incident-pack.pdf')!.async('uint8array')) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('Halina Wróbel');
    expect(text).toContain('What stood at 10 Mar 2026, 13:00 CET (2026-03-10T12:00:00.000Z)');
    expect(text).toContain('Produced 20 Mar 2026, 10:00 CET by Sigrún Hallsdóttir');
    expect(text).toContain('Note: Shock reported at bench LEJ-B1');
    expect(text).toMatch(/In force since 02 Mar 2026, 11:00 CET/);
    expect(text).toContain(`${proc.code} version 1 Live fault-finding on a triac dimmer`);
    expect(text).not.toContain(`${proc.code} version 2`);
    expect(text).toContain('acknowledged version 1 on 02 Mar 2026');
    expect(text).toContain('RCD Type A 30 mA');
    expect(text).not.toContain('100 mA');
    expect(text).toContain('Latest pre-use check before then: 03 Mar 2026, 08:30 CET by Halina Wróbel, passed.');
    expect(text).not.toContain('did not trip');
    expect(text).toContain('SN TF3-11902 (CAT III 300 V), calibration due 2026-03-22');
    expect(text).not.toContain('2027-03-01');
    expect(text).not.toMatch(/Suspended/);
    expect(text).toContain('First aid and CPR from Red Cross Leipzig (EH-2026-118), 2026-01-05 to 2029-01-05: Checked and current');
  });

  it('when made, then the ZIP holds the evidence files byte for byte with a manifest of hashes, and the trail records the pack', async () => {
    const res = await pack({ personId: tech.id, at: MOMENT, benchId: bench.id });
    const zip = await JSZip.loadAsync(res.body as Buffer);
    const names = Object.keys(zip.files).filter((n) => !zip.files[n].dir).sort();
    expect(names).toHaveLength(4);
    expect(names.filter((n) => n.endsWith('rcd-test.png'))).toHaveLength(1);
    expect(names.filter((n) => n.endsWith('cpr-card.png'))).toHaveLength(1);
    const photo = await zip.file(names.find((n) => n.endsWith('rcd-test.png'))!)!.async('nodebuffer');
    expect(photo.equals(checkPhoto)).toBe(true);
    const manifest = JSON.parse(await zip.file('manifest.json')!.async('string'));
    expect(manifest).toMatchObject({ person: 'Halina Wróbel', at: '2026-03-10T12:00:00.000Z', producedBy: 'Sigrún Hallsdóttir' });
    expect(manifest.files).toHaveLength(3);
    const entry = (await t.ownerQuery(`select new_values from audit_log where action = 'incident_pack.exported' order by id desc limit 1`)).rows[0].new_values;
    expect(entry).toMatchObject({ at: '2026-03-10T12:00:00.000Z', benchId: bench.id, files: 2 });
    expect(entry.pdfSha256).toBe(manifest.files[0].sha256);
  });

  it('when the bench was not on record yet, or the moment is to come, then 422 naming the field; a technician is refused', async () => {
    const early = await pack({ personId: tech.id, at: '2026-03-01T12:00:00Z', benchId: bench.id });
    expect(early.status).toBe(422);
    expect(JSON.parse(early.body.toString()).error.fields).toHaveProperty('benchId');
    const soon = await pack({ personId: tech.id, at: '2027-01-01T00:00:00Z' });
    expect(JSON.parse(soon.body.toString()).error.fields).toHaveProperty('at');
    const noBench = await pack({ personId: tech.id, at: MOMENT, benchId: '00000000-0000-4000-8000-000000000000' });
    expect(noBench.status).toBe(422);
    expect(JSON.parse(noBench.body.toString()).error.fields).toHaveProperty('benchId');
    expect((await tech.post('/api/incident-packs').send({ personId: tech.id, at: MOMENT })).status).toBe(403);
  });
});

describe('overdue acknowledgements on the overview', () => {
  it('when a re-read was due and not done, then the overview lists the person with the version and the due day', async () => {
    const res = await auditor.get('/api/overview');
    expect(res.body.overdueAcknowledgements.items).toContainEqual({ personId: tech.id, personName: 'Halina Wróbel', siteCode: 'LEJ-W1', procedureCode: proc.code, versionNumber: 2, dueOn: '2026-03-13' });
  });
});
