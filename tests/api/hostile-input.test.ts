import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, newPerson } from '../support/authorisations.js';
import { changedTables, fingerprint } from '../support/fingerprint.js';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let techId: string;
let siteId: string;

beforeAll(async () => {
  t = await makeTestApp();
  admin = await signIn(t, DEMO.admin);
  manager = await signIn(t, DEMO.manager);
  const { rows } = await t.ownerQuery('select id, site_id from users where email = $1', [DEMO.technician]);
  [techId, siteId] = [rows[0].id, rows[0].site_id];
});

const BAD_NAMES: [string, string, string][] = [
  ['a NUL byte', 'Tomasz\u0000Wójcik', 'must not contain control characters'],
  ['a lone surrogate', 'Tomasz \ud800Wójcik', 'must not contain broken characters (unpaired surrogates)'],
  ['a right-to-left override', 'Tomasz \u202eкиcjóW', 'must not contain characters that reverse the reading direction'],
  ['an isolate', '\u2066Tomasz\u2069', 'must not contain characters that reverse the reading direction'],
  ['only invisible characters', '\u200b\u2060\u200b', 'must contain something visible'],
  ['only Hangul fillers', '\u3164\u3164', 'must contain something visible'],
  ['no letter', '12345', 'must contain a letter'],
  ['a line break', 'Tomasz\nWójcik', 'must be on one line'],
];
const BAD_DATES = ['2026-02-30', '2026-13-01', '0000-01-01', '1899-12-31', '2200-01-01'];
const DATE_MESSAGE = 'must be a real date between 1900 and 2199';

/** Sends the request and checks the answer is 400 naming the field with the message, and that nothing was written. */
async function refused(send: () => Promise<{ status: number; body: any }>, field: string, message: string) {
  const before = await fingerprint(t);
  const res = await send();
  expect(res.status, JSON.stringify(res.body)).toBe(400);
  expect(res.body.error.fields[field]).toBe(message);
  expect(changedTables(before, await fingerprint(t))).toEqual([]);
}

describe('hostile names and dates are refused with 400 naming the field, and nothing is written', () => {
  it.each(BAD_NAMES)('when a person is renamed to a name with %s, then 400 names the field', async (_what, name, message) => {
    await refused(() => admin.patch(`/api/people/${techId}`).send({ name }), 'name', message);
  });

  it.each(BAD_NAMES)('when a person is invited with a name with %s, then 400 names the field', async (_what, name, message) => {
    await refused(() => admin.post('/api/people').send({ email: 'new.person@test.invalid', name, siteId, roles: ['technician'] }), 'name', message);
  });

  it.each(BAD_DATES)('when the access end is %s, then the invitation and the change are refused', async (date) => {
    await refused(() => admin.post('/api/people').send({ email: 'new.person@test.invalid', name: 'New Person', siteId, roles: ['technician'], accessEndsOn: date }), 'accessEndsOn', DATE_MESSAGE);
    await refused(() => admin.patch(`/api/people/${techId}`).send({ accessEndsOn: date }), 'accessEndsOn', DATE_MESSAGE);
  });

  it.each(BAD_DATES)('when a certificate is issued or expires on %s, then it is refused', async (date) => {
    const body = { holderId: techId, kind: 'first_aid_cpr', issuer: 'Red Cross Leipzig', reference: 'EH-1', issuedOn: '2026-01-10', expiresOn: '2028-01-09' };
    await refused(() => manager.post('/api/certificates').send({ ...body, issuedOn: date }), 'issuedOn', DATE_MESSAGE);
    await refused(() => manager.post('/api/certificates').send({ ...body, expiresOn: date }), 'expiresOn', DATE_MESSAGE);
  });

  it('when a certificate names its issuer with a right-to-left override, then it is refused naming the issuer', async () => {
    const body = { holderId: techId, kind: 'first_aid_cpr', issuer: 'Red Cross \u202egizpieL', issuedOn: '2026-01-10', expiresOn: '2028-01-09' };
    await refused(() => manager.post('/api/certificates').send(body), 'issuer', 'must not contain characters that reverse the reading direction');
  });

  it('when a paper authorisation has an impossible date or an invisible attester, then it is refused naming the field', async () => {
    const scope = await makeScope(manager);
    const tech = await newPerson(t);
    const body = { holderId: tech.id, scopeId: scope.id, issuedOn: '2025-06-01', expiresOn: '2026-05-31', attestedBy: 'Heike Krause', password: DEMO_PASSWORD };
    await refused(() => manager.post('/api/authorisations/prior').send({ ...body, issuedOn: '2025-02-29' }), 'issuedOn', DATE_MESSAGE);
    await refused(() => manager.post('/api/authorisations/prior').send({ ...body, attestedBy: '\u200b\u200b\u200b' }), 'attestedBy', 'must contain something visible');
  });

  it('when the register is asked for a moment in year 0 or on 30 February, then 400 names the query field', async () => {
    for (const at of ['0000-01-01T00:00:00Z', '2026-02-30T12:00:00Z']) {
      const res = await admin.get('/api/register').query({ at });
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['query.at']);
    }
  });

  it('when a search holds a NUL byte, then 400 names the query field', async () => {
    const res = await admin.get('/api/people').query({ q: 'a\u0000b' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['query.q']).toBe('must not contain control characters');
  });

  it('when a name is written in decomposed form, then it is stored composed (one spelling per name)', async () => {
    const res = await admin.patch(`/api/people/${techId}`).send({ name: 'Tomasz Wo\u0301jcik' });
    expect(res.status).toBe(200);
    expect((await admin.get(`/api/people/${techId}`)).body.name).toBe('Tomasz W\u00f3jcik');
  });
});
