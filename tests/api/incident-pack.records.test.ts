import { describe, it, expect, beforeAll } from 'vitest';
import JSZip from 'jszip';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';
import { makePng } from '../fixtures/evidence-files.js';
import { makeScope, newPerson, PERSON_PASSWORD, type Person } from '../support/authorisations.js';

// The person (Leipzig) is assessed on CLE-B1 (Cleveland, Type AC RCD accepted by a manager) and signs off
// with a photo; a paper authorisation from 2025 is recorded for them after their account was created.
let t: TestApp;
let auditor: Awaited<ReturnType<typeof signIn>>;
let tech: Person;
let photo: Buffer;
let cleB1: string;
const REASON = 'A Type A 30 mA device is fitted ahead of this bench in the sub-board.';

beforeAll(async () => {
  t = await makeTestApp();
  const manager = await signIn(t, DEMO.manager);
  const assessor = await signIn(t, DEMO.assessor);
  auditor = await signIn(t, DEMO.auditor);
  const proc = await publishRecordsProcedure(t);
  const ids = await lookups(assessor);
  cleB1 = ids.benches['CLE-B1'];
  tech = await newPerson(t, { name: 'Jana Novotná' });
  const scope = await makeScope(manager, { title: 'Dead work on mains equipment' });
  expect((await manager.post('/api/authorisations/prior').send({
    holderId: tech.id, scopeId: scope.id, issuedOn: '2025-06-01', expiresOn: '2026-05-31', attestedBy: 'Heike Krause, former workshop lead', password: DEMO_PASSWORD,
  })).status).toBe(201);
  expect((await manager.post(`/api/benches/${ids.benches['CLE-B1']}/type-ac-decisions`).send({ reason: REASON })).status).toBe(201);
  const p = await assessor.post('/api/practicals').send({
    technicianId: tech.id, benchId: ids.benches['CLE-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [ids.instruments['OW40-77120']], circuit: CIRCUIT,
    crossSiteReason: 'Seconded to Cleveland for the heater regulator week.',
  });
  expect(p.status, JSON.stringify(p.body)).toBe(201);

  const s = (await tech.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.selfSignOff.id })).body;
  const put = (prompt: string, body: Record<string, unknown>) => tech.put(`/api/signoffs/${s.id}/items/${itemByPrompt(s, prompt).id}`).send(body);
  await put('I proved', { checked: true });
  await put('Serial number', { text: 'DIM-2291' });
  await put('Supply voltage', { value: 231, unit: 'V' });
  photo = makePng(6, 4);
  const up = await tech.post('/api/evidence').field('entity', 'signoff').field('entityId', s.id).attach('file', photo, 'bench-set-up.png');
  await put('Photo of the test set-up', { evidenceId: up.body.id });
  expect((await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: PERSON_PASSWORD })).status).toBe(200);
  expect((await assessor.post(`/api/signoffs/${s.id}/countersign`).send({ password: DEMO_PASSWORD })).status).toBe(200);
  t.clock.advance(3_600_000);
});

async function pack(at: string, benchId?: string) {
  const res = await asBytes(auditor.post('/api/incident-packs').send({ personId: tech.id, at, benchId }));
  expect(res.status, res.body.toString()).toBe(200);
  const zip = await JSZip.loadAsync(res.body as Buffer);
  const parser = new PDFParse({ data: new Uint8Array(await zip.file('incident-pack.pdf')!.async('uint8array')) });
  const text = (await parser.getText()).text.replace(/\s+/g, ' ');
  await parser.destroy();
  return { zip, text };
}

describe('the incident pack holds every record that stood', () => {
  it('when made after a practical and a sign-off, then it names the procedure version, bench, instruments, the cross-site reason and the Type AC decision', async () => {
    const { text } = await pack(t.clock.now().toISOString());
    expect(text).toContain('How each practical was set up');
    expect(text).toMatch(/version 1 Live test of a phase-angle lamp dimmer behind an isolating transformer/);
    expect(text).toContain('Bench CLE-B1 Heater regulator bench (120 V 60 Hz)');
    expect(text).toContain('instruments: Ohmwerk CM 40 SN OW40-77120.');
    expect(text).toContain("Bench at another site than the technician's. Reason given: Seconded to Cleveland for the heater regulator week.");
    expect(text).toContain(`Type AC RCD accepted by Jörg Łukasik on 02 Mar 2026, 10:00 CET: ${REASON}`);
    expect(text).not.toContain('Type AC RCD accepted for practicals by');
    const withBench = await pack(t.clock.now().toISOString(), cleB1);
    expect(withBench.text).toContain(`Type AC RCD accepted for practicals by Jörg Łukasik on 02 Mar 2026, 10:00 CET: ${REASON}`);
  });

  it('when made, then each sign-off is there with its state then and its evidence, listed by SHA-256 and in the ZIP byte for byte', async () => {
    const { zip, text } = await pack(t.clock.now().toISOString());
    expect(text).toMatch(/Technician sign-off: started 02 Mar 2026, 10:00 CET, signed 02 Mar 2026, 10:00 CET; countersigned by Priya Natarajan\./);
    const manifest = JSON.parse(await zip.file('manifest.json')!.async('string'));
    const entry = manifest.files.find((f: { path: string }) => f.path.endsWith('bench-set-up.png'));
    expect(entry).toBeDefined();
    expect(text).toContain(`Evidence: bench-set-up.png sha256 ${entry.sha256}`);
    expect((await zip.file(entry.path)!.async('nodebuffer')).equals(photo)).toBe(true);
  });

  it('when the moment is before the person’s account, then the pack answers from the paper record and says it was recorded later', async () => {
    const { text } = await pack('2025-09-01T10:00:00Z');
    expect(text).toContain("Jana Novotná's account was created on 02 Mar 2026, 10:00 CET, after this moment: everything below for this moment was recorded later, from paper records.");
    expect(text).toMatch(/Dead work on mains equipment: In force since/);
    expect(text).toMatch(/Recorded later .*Dead work on mains equipment: .*recorded 02 Mar 2026, 10:00 CET, from a paper record attested by Heike Krause, former workshop lead/);
    expect(text).toContain('Sign-offs None started by then.');
  });
});
