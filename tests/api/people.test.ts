import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, PUBLIC_URL, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { linkToken, parseEml } from '../support/mail.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let technician: Awaited<ReturnType<typeof signIn>>;
let sites: { id: string; code: string }[];

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager2);
  technician = await signIn(t, DEMO.technician);
  sites = (await manager.get('/api/sites')).body;
});

const site = (code: string) => sites.find((s) => s.code === code)!.id;
const tableCount = async (table: string) => Number((await t.ownerQuery(`select count(*) from ${table}`)).rows[0].count);

describe('invitation', () => {
  it('when a manager invites a person, then an .eml with a one-time link arrives, and the link sets a password that signs in', async () => {
    const before = t.mails().length;
    const res = await manager.post('/api/people').send({ email: 'New.Person@Example.test', name: 'Nell Okafor', siteId: site('CLE-L2'), roles: ['technician'] });
    expect(res.status).toBe(201);
    expect(res.body.email).toBe('new.person@example.test');
    const mails = t.mails();
    expect(mails.length).toBe(before + 1);
    const eml = mails.at(-1)!;
    const parsed = await parseEml(eml);
    expect(parsed.to).toBe('new.person@example.test');
    expect(parsed.text, 'the link is built from the configured public URL').toContain(`${PUBLIC_URL}/set-password?token=`);
    const token = await linkToken(eml);
    expect((await t.request().get('/api/password/link').query({ token })).body).toMatchObject({ name: 'Nell Okafor', purpose: 'invite' });

    const weak = await t.request().post('/api/password/set').send({ token, password: 'passwordpassword' });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields.password).toMatch(/common/);
    const set = await t.request().post('/api/password/set').send({ token, password: 'copper tape on the heatsink fins' });
    expect(set.status).toBe(200);
    const again = await t.request().post('/api/password/set').send({ token, password: 'another long passphrase here' });
    expect(again.status, 'the link works once').toBe(404);
    const session = await t.agent().post('/api/session').send({ email: 'new.person@example.test', password: 'copper tape on the heatsink fins' });
    expect(session.status).toBe(200);
  });

  it('when the link has expired, then it no longer sets a password', async () => {
    await manager.post('/api/people').send({ email: 'late@example.test', name: 'Late Comer', siteId: site('CLE-L2'), roles: ['technician'] });
    const token = await linkToken(t.mails().at(-1)!);
    t.clock.advance(73 * 3_600_000);
    const res = await t.request().post('/api/password/set').send({ token, password: 'copper tape on the heatsink fins' });
    expect(res.status).toBe(404);
  });

  it('when "forgot password" is asked for an unknown address, then the answer is the same and no mail goes out', async () => {
    const before = t.mails().length;
    const unknown = await t.request().post('/api/password/forgot').send({ email: 'nobody@example.test' });
    expect(unknown.status).toBe(202);
    expect(t.mails().length).toBe(before);
    const known = await t.request().post('/api/password/forgot').send({ email: DEMO.technician3 });
    expect(known.body).toEqual(unknown.body);
    expect(t.mails().length).toBe(before + 1);
  });
});

describe('who sees and edits whom', () => {
  it('when a technician lists people, then only they are in it', async () => {
    const res = await technician.get('/api/people');
    expect(res.status).toBe(200);
    expect(res.body.items.map((p: { email: string }) => p.email)).toEqual([DEMO.technician]);
    expect(res.body.total).toBe(1);
  });

  it('when a technician opens their own record, then it is there; another person\'s, then 403', async () => {
    expect((await technician.get(`/api/people/${technician.user.id}`)).status).toBe(200);
    expect((await technician.get(`/api/people/${manager.user.id}`)).status).toBe(403);
  });

  it('when a manager lists people, then only the sites they cover appear', async () => {
    const res = await manager.get('/api/people').query({ pageSize: 200 });
    const siteIds = new Set(res.body.items.map((p: { siteId: string }) => p.siteId));
    expect([...siteIds]).toEqual([site('CLE-L2')]);
    const other = await manager.get(`/api/people/${technician.user.id}`);
    expect(other.status).toBe(403);
  });

  it('when an admin pages, sorts and searches, then the server does it', async () => {
    const admin = await signIn(t, DEMO.admin);
    const page1 = await admin.get('/api/people').query({ pageSize: 3, page: 1, sort: 'email', dir: 'desc' });
    expect(page1.body.items).toHaveLength(3);
    const emails = page1.body.items.map((p: { email: string }) => p.email);
    expect([...emails].sort().reverse()).toEqual(emails);
    const page2 = await admin.get('/api/people').query({ pageSize: 3, page: 2, sort: 'email', dir: 'desc' });
    expect(page2.body.items[0].email < emails[2]).toBe(true);
    const found = await admin.get('/api/people').query({ q: 'wójcik' });
    expect(found.body.items.map((p: { email: string }) => p.email)).toEqual([DEMO.technician]);
  });

  it('when a technician tries to give themselves a role, then 403 and nothing changes', async () => {
    const audit = await tableCount('audit_log');
    const res = await technician.patch(`/api/people/${technician.user.id}`).send({ roles: ['technician', 'admin'] });
    expect(res.status).toBe(403);
    const roles = await t.ownerQuery('select role from user_roles where user_id = $1', [technician.user.id]);
    expect(roles.rows.map((r) => r.role)).toEqual(['technician']);
    expect(await tableCount('audit_log')).toBe(audit);
  });

  it('when a manager tries to make someone an admin, then 403', async () => {
    const tech3 = (await manager.get('/api/people').query({ q: 'boateng' })).body.items[0];
    const res = await manager.patch(`/api/people/${tech3.id}`).send({ roles: ['technician', 'admin'] });
    expect(res.status).toBe(403);
    const ok = await manager.patch(`/api/people/${tech3.id}`).send({ roles: ['technician', 'assessor'] });
    expect(ok.status).toBe(200);
    expect(ok.body.roles).toEqual(['assessor', 'technician']);
  });

  it('when a technician renames themselves, then it is kept and audited', async () => {
    const res = await technician.patch(`/api/people/${technician.user.id}`).send({ name: 'Tomasz Wójcik-Nowak' });
    expect(res.status).toBe(200);
    const last = await t.ownerQuery(`select action, old_values, new_values from audit_log order by id desc limit 1`);
    expect(last.rows[0]).toMatchObject({ action: 'person.updated', old_values: { name: 'Tomasz Wójcik' }, new_values: { name: 'Tomasz Wójcik-Nowak' } });
  });
});

describe('bad input changes nothing', () => {
  it('malformed JSON, wrong types, oversized strings, unknown ids and unknown fields get 4xx naming the field', async () => {
    const users = await tableCount('users');
    const malformed = await manager.post('/api/people').set('Content-Type', 'application/json').send('{"email": ');
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.code).toBe('malformed_json');
    const wrongType = await manager.post('/api/people').send({ email: 42, name: 'X', siteId: site('CLE-L2'), roles: ['technician'] });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.error.fields).toHaveProperty('email');
    const long = await manager.post('/api/people').send({ email: 'long@example.test', name: 'N'.repeat(5000), siteId: site('CLE-L2'), roles: ['technician'] });
    expect(long.status).toBe(400);
    expect(long.body.error.fields).toHaveProperty('name');
    const badRole = await manager.post('/api/people').send({ email: 'r@example.test', name: 'R', siteId: site('CLE-L2'), roles: ['overlord'] });
    expect(badRole.status).toBe(400);
    expect(Object.keys(badRole.body.error.fields)[0]).toMatch(/^roles/);
    const unknownSite = await manager.post('/api/people').send({ email: 'u@example.test', name: 'U', siteId: '00000000-0000-4000-8000-000000000001', roles: ['technician'] });
    expect(unknownSite.status).toBe(403);
    const unknownPerson = await manager.get('/api/people/00000000-0000-4000-8000-000000000001');
    expect(unknownPerson.status).toBe(404);
    const notUuid = await manager.get('/api/people/not-a-uuid');
    expect(notUuid.status).toBe(400);
    expect(notUuid.body.error.fields).toHaveProperty('params.id');
    const extra = await technician.patch(`/api/people/${technician.user.id}`).send({ name: 'T', passwordHash: 'x' });
    expect(extra.status).toBe(400);
    const duplicate = await manager.post('/api/people').send({ email: DEMO.technician3, name: 'Dup', siteId: site('CLE-L2'), roles: ['technician'] });
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error.fields).toHaveProperty('email');
    expect(await tableCount('users')).toBe(users);
  });
});
