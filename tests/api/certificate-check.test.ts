import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { newPerson, submitCertificate, type Person } from '../support/authorisations.js';
import { makePng } from '../fixtures/evidence-files.js';

// The test clock starts on 2026-03-02 (Leipzig).
let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let tech: Person;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  tech = await newPerson(t, { name: 'Ewa Kowalczyk' });
});

const statusOf = async (id: string) => (await t.ownerQuery('select status, checked_how, original_seen_where, original_seen_on::text from external_certificates where id = $1', [id])).rows[0];
const verify = (id: string, body: Record<string, unknown>) => manager.post(`/api/certificates/${id}/verify`).send({ password: DEMO_PASSWORD, ...body });

describe('checking an external certificate', () => {
  it('when no scan is on file and the manager does not state they saw the original, then 422 naming sawOriginal and nothing changes', async () => {
    const id = await submitCertificate(tech, { issuedOn: '2026-01-10', expiresOn: '2028-01-10' });
    const res = await verify(id, {});
    expect(res.status).toBe(422);
    expect(res.body.error.fields.sawOriginal).toBe('no scan is on file: state that you saw the original in person');
    const noWhere = await verify(id, { sawOriginal: true });
    expect(noWhere.body.error.fields.sawOriginalWhere).toBe('say where you saw the original');
    const future = await verify(id, { sawOriginal: true, sawOriginalWhere: 'Workshop office', sawOriginalOn: '2026-03-09' });
    expect(future.body.error.fields.sawOriginalOn).toBe('cannot be in the future');
    const before = await verify(id, { sawOriginal: true, sawOriginalWhere: 'Workshop office', sawOriginalOn: '2026-01-09' });
    expect(before.body.error.fields.sawOriginalOn).toBe('cannot be before the certificate was issued');
    expect(await statusOf(id)).toEqual({ status: 'submitted', checked_how: null, original_seen_where: null, original_seen_on: null });
  });

  it('when the manager saw the original in person, then the record says where and when, and the trail too', async () => {
    const id = await submitCertificate(tech, { kind: 'cpr_aed', issuedOn: '2026-01-10', expiresOn: '2028-01-10' });
    const res = await verify(id, { sawOriginal: true, sawOriginalWhere: 'Leipzig workshop office', sawOriginalOn: '2026-02-27' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ status: 'verified', checkedHow: 'original_seen', originalSeen: { where: 'Leipzig workshop office', on: '2026-02-27' } });
    const trail = await t.ownerQuery(`select new_values from audit_log where action = 'certificate.verified' and entity_id = $1`, [id]);
    expect(trail.rows[0].new_values).toMatchObject({ checkedHow: 'original_seen', originalSeenWhere: 'Leipzig workshop office', originalSeenOn: '2026-02-27' });
  });

  it('when a scan is on file, then the check is recorded as made against the scan', async () => {
    const scan = await tech.post('/api/evidence').attach('file', makePng(4, 4), { filename: 'card.png', contentType: 'image/png' });
    const res = await tech.post('/api/certificates').send({ kind: 'first_aid', issuer: 'Red Cross Leipzig', reference: 'EH-9', issuedOn: '2026-01-10', expiresOn: '2028-01-10', evidenceId: scan.body.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const checked = await verify(res.body.id, {});
    expect(checked.status).toBe(200);
    expect(checked.body).toMatchObject({ checkedHow: 'scan', originalSeen: null });
  });
});
