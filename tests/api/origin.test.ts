import { beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, PUBLIC_URL, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';

// Writes must prove they come from our own pages: Origin, else Sec-Fetch-Site same-origin, else our Referer.
let t: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;
let n = 0;

beforeAll(async () => {
  t = await makeTestApp();
  admin = await signIn(t, DEMO.admin);
});

const newSite = () => ({ code: `ORG-${++n}`, name: `Origin test site ${n}`, timeZone: 'Europe/Vienna', personTerm: 'skilled person' });
const siteCodes = async () => ((await admin.get('/api/sites')).body as { code: string }[]).map((s) => s.code);
/** A site creation with the admin's session cookie but without the Origin our agents send by default. */
const createWithout = (site: object) => admin.post('/api/sites').unset('Origin').send(site);

describe('writes without an Origin header', () => {
  it('when a cookie-carrying write has no Origin and a foreign Referer, then 403 names Origin and no site is made', async () => {
    const site = newSite();
    const res = await createWithout(site).set('Referer', 'https://evil.example/page');
    expect(res.status).toBe(403);
    expect(res.body.error).toMatchObject({ code: 'bad_origin', message: `Origin: writes must carry an Origin header from ${PUBLIC_URL}.` });
    expect(await siteCodes()).not.toContain(site.code);
  });

  it('when a body-less text/plain write comes without Origin, then it is refused and the session stays', async () => {
    const res = await admin.delete('/api/session').unset('Origin').set('Content-Type', 'text/plain');
    expect(res.status).toBe(403);
    expect((await admin.get('/api/session')).status).toBe(200);
  });

  it('when the browser says Sec-Fetch-Site same-origin, then the write is accepted', async () => {
    const site = newSite();
    expect((await createWithout(site).set('Sec-Fetch-Site', 'same-origin')).status).toBe(201);
    expect(await siteCodes()).toContain(site.code);
  });

  it.each(['cross-site', 'same-site', 'none'])('when Sec-Fetch-Site is %s, then 403 and no site is made', async (value) => {
    const site = newSite();
    const res = await createWithout(site).set('Sec-Fetch-Site', value).set('Referer', `${PUBLIC_URL}/sites`);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/^Sec-Fetch-Site/);
    expect(await siteCodes()).not.toContain(site.code);
  });

  it('when neither Origin nor Sec-Fetch-Site comes but the Referer is one of our pages, then the write is accepted', async () => {
    const site = newSite();
    expect((await createWithout(site).set('Referer', `${PUBLIC_URL}/sites?page=2`)).status).toBe(201);
    expect(await siteCodes()).toContain(site.code);
  });

  it('when a sign-in comes with no Origin, Sec-Fetch-Site or Referer, then 403 (a forged sign-in is refused too)', async () => {
    const res = await t.request().post('/api/session').unset('Origin').send({ email: DEMO.technician, password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.headers['set-cookie']).toBeUndefined();
  });
});

describe('writes with an Origin header', () => {
  it.each(['https://evil.example', 'null', 'http://breakover.test:8080'])('when Origin is %s, then 403 names it and no site is made', async (origin) => {
    const site = newSite();
    const res = await admin.post('/api/sites').set('Origin', origin).send(site);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toContain(`requests from ${origin} are not accepted`);
    expect(await siteCodes()).not.toContain(site.code);
  });
});

describe('the body\'s media type', () => {
  it('when the body is form-encoded, then 415 says to send JSON, even from our own origin', async () => {
    const site = newSite();
    const res = await admin.post('/api/sites').type('form').send(site);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toBe('Content-Type: send the body as application/json (got application/x-www-form-urlencoded).');
    expect(await siteCodes()).not.toContain(site.code);
  });

  it('when a JSON text is sent as text/plain, then 415', async () => {
    const res = await admin.post('/api/sites').set('Content-Type', 'text/plain').send(JSON.stringify(newSite()));
    expect(res.status).toBe(415);
  });

  it('when a multipart form goes to a route that takes no upload, then 415; a body-less write with no Content-Type passes', async () => {
    const res = await admin.post('/api/sites').field('code', 'ORG-MP').field('name', 'Multipart site');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/got multipart\/form-data/);
    const other = await signIn(t, DEMO.technician);
    expect((await other.delete('/api/session')).status).toBe(204);
  });
});
