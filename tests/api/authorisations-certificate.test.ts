import { describe, it, expect, beforeAll } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, PUBLIC_URL, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, mineFor, newPerson, submitCertificate, verifyCertificate, type Person } from '../support/authorisations.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let tech: Person;
let item: NonNullable<Awaited<ReturnType<typeof mineFor>>>;
let code: string;
let scope: { id: string; title: string };

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  scope = await makeScope(manager, { title: 'Live testing behind a 230 V isolating transformer', allowsLiveWork: true, maxVoltageV: 250, maxCurrentA: 10, validityMonths: 12 });
  tech = await newPerson(t, { name: 'Zoë Kowalczyk-Ørsted' });
  await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2028-11-05' }), DEMO_PASSWORD);
  item = (await mineFor(tech, scope.id))!;
  code = (await t.ownerQuery('select verification_code from authorisation_periods where id = $1', [item.periodId])).rows[0].verification_code;
});

async function pdf(agent: ReturnType<TestApp['agent']>, id: string) {
  const res = await agent.get(`/api/authorisations/${id}/certificate`).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  return res;
}

describe('the certificate PDF', () => {
  it('when the holder opens it, then its text has the holder, scope, limits, dates, issuer, evidence, code, link and caution, and it carries the QR code', async () => {
    const res = await pdf(tech, item.id);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    try {
      const { text } = await parser.getText();
      const flat = text.replace(/\s+/g, ' ');
      for (const s of ['Zoë Kowalczyk-Ørsted', 'Live testing behind a 230 V isolating transformer', 'up to 250 V and 10 A', 'from 2 Mar 2026 to 2 Mar 2027', code, `${PUBLIC_URL}/verify/${code}`, 'Red Cross Leipzig', 'Mains voltage can kill', 'covers only the work, voltage and current stated on it']) {
        expect(flat).toContain(s);
      }
      expect(flat).toMatch(/when the last requirement was met \(recorded by Jörg Łukasik\)/);
      const images = await parser.getImage();
      expect(images.pages[0].images.length, 'the QR code').toBe(1);
    } finally {
      await parser.destroy();
    }
  });

  it('when another technician asks for it, then 403', async () => {
    const other = await signIn(t, DEMO.technician2);
    expect((await other.get(`/api/authorisations/${item.id}/certificate`)).status).toBe(403);
  });
});

describe('the public verification page', () => {
  it('when anyone opens a known code, then only holder, scope, validity and "current" come back, without signing in', async () => {
    const res = await t.request().get(`/api/verify/${code}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ holderName: 'Zoë Kowalczyk-Ørsted', scopeTitle: scope.title, validFrom: '2026-03-02', validUntil: '2027-03-02', state: 'current' });
    expect((await t.request().get(`/api/verify/${code.toLowerCase().replace(/(.{4})/g, '$1-')}`)).body.state, 'typed from paper in lower case with hyphens').toBe('current');
  });

  it('when the code is unknown or malformed, then a plain "not found"', async () => {
    for (const c of ['A'.repeat(32), 'nonsense', code.slice(0, 31)]) {
      const res = await t.request().get(`/api/verify/${c}`);
      expect(res.status).toBe(404);
      expect(res.body.error.message).toBe('not found');
    }
  });

  it('when the authorisation is suspended, then it shows "not current" and says nothing of why', async () => {
    await manager.post(`/api/authorisations/${item.id}/suspend`).send({ reason: 'Earthed scope clip on the secondary side', password: DEMO_PASSWORD });
    const res = await t.request().get(`/api/verify/${code}`);
    expect(res.body.state).toBe('not current');
    expect(Object.keys(res.body).sort()).toEqual(['holderName', 'scopeTitle', 'state', 'validFrom', 'validUntil']);
    expect(JSON.stringify(res.body)).not.toMatch(/clip|suspend/i);
    await manager.post(`/api/authorisations/${item.id}/reinstate`).send({ reason: 'Briefed on floating measurements', password: DEMO_PASSWORD });
  });
});

describe('who sees what', () => {
  it('when a technician lists authorisations, then only their own are there; another person\'s record, eligibility and details are refused', async () => {
    const other = await signIn(t, DEMO.technician2);
    const list = await other.get('/api/authorisations').query({ pageSize: 200 });
    expect(list.status).toBe(200);
    expect(list.body.items.every((i: { holder: { id: string } }) => i.holder.id === other.user.id)).toBe(true);
    expect((await other.get(`/api/authorisations/${item.id}`)).status).toBe(403);
    expect((await other.get(`/api/eligibility/${tech.id}`)).status).toBe(403);
    expect((await tech.get(`/api/eligibility/${tech.id}`)).status).toBe(200);
  });

  it('when an auditor or the holder\'s manager looks, then they see it; a manager of another site neither sees nor acts on it', async () => {
    const auditor = await signIn(t, DEMO.auditor);
    expect((await auditor.get(`/api/authorisations/${item.id}`)).status).toBe(200);
    expect((await auditor.get(`/api/eligibility/${tech.id}/${scope.id}`)).body.scopes[0].requirements[0].met).toBe(true);
    expect((await manager.get(`/api/eligibility/${tech.id}`)).status).toBe(200);
    const elsewhere = await signIn(t, DEMO.manager2);
    expect((await elsewhere.get(`/api/authorisations/${item.id}`)).status).toBe(403);
    expect((await elsewhere.post(`/api/authorisations/${item.id}/suspend`).send({ reason: 'Not my site', password: DEMO_PASSWORD })).status).toBe(403);
    expect((await auditor.post(`/api/authorisations/${item.id}/suspend`).send({ reason: 'Auditors write nothing', password: DEMO_PASSWORD })).status).toBe(403);
  });

  it('when a manager checks their own certificate, then 403; the holder cannot check it either', async () => {
    const own = await submitCertificate(Object.assign(manager, { id: manager.user.id }) as unknown as Person, { issuedOn: '2026-01-05', expiresOn: '2028-01-05' });
    expect((await manager.post(`/api/certificates/${own}/verify`).send({ password: DEMO_PASSWORD })).status).toBe(403);
    const mine = await submitCertificate(tech, { kind: 'cpr_aed', issuedOn: '2026-01-05', expiresOn: '2028-01-05' });
    expect((await tech.post(`/api/certificates/${mine}/verify`).send({ password: 'whatever-it-is' })).status).toBe(403);
  });

  it('when a certificate is sent with bad dates, then 422 naming the field and nothing is stored', async () => {
    const before = (await t.ownerQuery('select count(*)::int as n from external_certificates')).rows[0].n;
    const reversed = await tech.post('/api/certificates').send({ kind: 'first_aid_cpr', issuer: 'Red Cross', issuedOn: '2026-02-01', expiresOn: '2026-01-01' });
    expect(reversed.status).toBe(422);
    expect(reversed.body.error.fields.expiresOn).toBeTruthy();
    const future = await tech.post('/api/certificates').send({ kind: 'first_aid_cpr', issuer: 'Red Cross', issuedOn: '2027-02-01', expiresOn: '2029-01-01' });
    expect(future.body.error.fields.issuedOn).toBe('cannot be in the future');
    const badKind = await tech.post('/api/certificates').send({ kind: 'forklift', issuer: 'Red Cross', issuedOn: '2026-02-01', expiresOn: '2027-01-01' });
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fields.kind).toBeTruthy();
    expect((await t.ownerQuery('select count(*)::int as n from external_certificates')).rows[0].n).toBe(before);
  });
});
