import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, mineFor, newPerson } from '../support/authorisations.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let scope: { id: string; code: string; title: string };

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  scope = await makeScope(manager, { title: 'Dead work on mains equipment' });
});

const count = async (table: string) => (await t.ownerQuery(`select count(*)::int as n from ${table}`)).rows[0].n as number;
const counts = async () => ({ users: await count('users'), periods: await count('authorisation_periods'), events: await count('authorisation_events') });

describe('an authorisation held on paper before the portal', () => {
  it('when a manager records it with the original dates and who attested it, then it is in force, marked as recorded from before, and signed', async () => {
    const tech = await newPerson(t);
    const res = await manager.post('/api/authorisations/prior').send({
      holderId: tech.id, scopeId: scope.id, issuedOn: '2025-06-01', expiresOn: '2026-05-31', attestedBy: 'Heike Krause, former workshop lead (register p. 14)', note: 'Scan in the personnel file', password: DEMO_PASSWORD,
    });
    expect(res.status).toBe(201);
    const mine = (await mineFor(tech, scope.id))!;
    expect(mine).toMatchObject({ state: 'active', validFrom: '2025-06-01', validUntil: '2026-05-31', recordedFromBefore: true });
    const d = (await manager.get(`/api/authorisations/${mine.id}`)).body;
    expect(d.periods[0]).toMatchObject({ origin: 'prior', recordedFromBefore: true, attestedBy: 'Heike Krause, former workshop lead (register p. 14) (recorded from before the portal)' });
    expect(d.periods[0].events[0]).toMatchObject({ kind: 'issued', effectiveAt: '2025-05-31T22:00:00.000Z', recordedAt: t.clock.now().toISOString(), signature: { meaning: 'Recorded from the paper record as attested' } });
  });

  it('when the dates overlap what the person already holds, are in the future, or the password is wrong, then it is refused naming the field and nothing is written', async () => {
    const tech = await newPerson(t);
    const body = { holderId: tech.id, scopeId: scope.id, issuedOn: '2025-01-10', expiresOn: '2026-01-09', attestedBy: 'Heike Krause', password: DEMO_PASSWORD };
    expect((await manager.post('/api/authorisations/prior').send(body)).status).toBe(201);
    const before = await counts();
    const overlap = await manager.post('/api/authorisations/prior').send({ ...body, issuedOn: '2025-12-01', expiresOn: '2026-11-30' });
    expect(overlap.status).toBe(409);
    expect(overlap.body.error.fields.issuedOn).toMatch(/overlaps a period from 10 Jan 2025 to 9 Jan 2026/);
    const future = await manager.post('/api/authorisations/prior').send({ ...body, issuedOn: '2026-04-01', expiresOn: '2027-03-31' });
    expect([future.status, future.body.error.fields.issuedOn]).toEqual([422, 'cannot be in the future']);
    const wrong = await manager.post('/api/authorisations/prior').send({ ...body, issuedOn: '2026-01-10', expiresOn: '2026-12-31', password: 'not the password' });
    expect([wrong.status, Object.keys(wrong.body.error.fields)]).toEqual([422, ['password']]);
    const tech2 = await signIn(t, DEMO.technician2);
    expect((await tech2.post('/api/authorisations/prior').send({ ...body, issuedOn: '2026-01-10', expiresOn: '2026-12-31' })).status).toBe(403);
    expect(await counts()).toEqual(before);
  });
});

describe('CSV import of people and their paper authorisations', () => {
  const header = 'email,name,site,roles,scope,issued_on,expires_on,attested_by,note';

  it('when the dry run meets bad rows, then it names each row\'s problems and writes nothing', async () => {
    const csv = [
      header,
      `new.one@example.test,Kasia Nowak,LEJ-W1,technician,${scope.code},2025-03-01,2026-02-28,Heike Krause,`,
      `new.two@example.test,Ole Brandt,XXX-9,technician,${scope.code},2025-03-01,2026-02-28,Heike Krause,`,
      `new.three@example.test,Ana Lima,LEJ-W1,admin,NO-SUCH,2025-13-01,2026-02-28,HK,`,
      `${DEMO.technician3},,,,${scope.code},2025-03-01,2026-02-28,Dana Whitcombe,`,
    ].join('\n');
    const before = await counts();
    const res = await manager.post('/api/authorisations/import').send({ csv, dryRun: true });
    expect(res.status).toBe(200);
    expect(res.body.ok).toBe(false);
    const byLine = Object.fromEntries(res.body.rows.map((r: { line: number; problems: string[] }) => [r.line, r.problems]));
    expect(byLine[2]).toEqual([]);
    expect(byLine[3]).toEqual(['site: no site with code “XXX-9”']);
    expect(byLine[4]).toEqual(expect.arrayContaining(['roles: you may give only technician, assessor', 'scope: no scope with code “NO-SUCH”', 'issued_on: must be a real date between 1900 and 2199', 'attested_by: name who attested the paper record']));
    expect(byLine[5], 'Jörg covers Cleveland, so Marcus Boateng is fine').toEqual([]);
    expect(await counts()).toEqual(before);
  });

  it('when the real run has one bad row, then nothing at all is written', async () => {
    const csv = [
      header,
      `good.person@example.test,Mia Vogel,LEJ-W1,technician,${scope.code},2025-03-01,2026-02-28,Heike Krause,`,
      `bad.person@example.test,Tim Beck,LEJ-W1,technician,${scope.code},2026-02-28,2025-03-01,Heike Krause,`,
    ].join('\n');
    const before = await counts();
    const res = await manager.post('/api/authorisations/import').send({ csv, dryRun: false, password: DEMO_PASSWORD });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/Nothing was written: 1 row\(s\) have problems, the first on line 3/);
    expect(res.body.error.fields['line 3']).toMatch(/expires_on: must be after the issue date/);
    expect(await counts()).toEqual(before);
  });

  it('when every row is good, then the people and their authorisations are written together, marked as recorded from before', async () => {
    const other = await makeScope(manager, { title: 'Live testing behind an isolating transformer' });
    const csv = [
      header,
      `lena.kraft@example.test,Lena Kraft,LEJ-W1,technician,${scope.code},2025-03-01,2026-08-31,Heike Krause,Register p. 3`,
      `lena.kraft@example.test,Lena Kraft,LEJ-W1,technician,${other.code},2025-04-01,2026-03-31,Heike Krause,Register p. 3`,
      `paul.ode@example.test,Paul Ode,CLE-L2,technician assessor,${scope.code},2024-09-01,2025-08-31,Dana Whitcombe,Already expired on paper`,
      'rosa.lind@example.test,Rosa Lind,CLE-L2,technician,,,,,',
    ].join('\n');
    expect((await manager.post('/api/authorisations/import').send({ csv, dryRun: false })).body.error.fields.password).toBeTruthy();
    const before = await counts();
    const res = await manager.post('/api/authorisations/import').send({ csv, dryRun: false, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ok: true, dryRun: false, written: { people: 3, authorisations: 3 } });
    const after = await counts();
    expect([after.users - before.users, after.periods - before.periods]).toEqual([3, 3]);
    const lena = (await t.ownerQuery(`select id from users where email = 'lena.kraft@example.test'`)).rows[0].id;
    const list = (await manager.get('/api/authorisations').query({ holderId: lena })).body.items as { state: string; recordedFromBefore: boolean; validUntil: string }[];
    expect(list.map((i) => [i.state, i.recordedFromBefore, i.validUntil]).sort()).toEqual([['active', true, '2026-03-31'], ['active', true, '2026-08-31']]);
    const paul = (await t.ownerQuery(`select id from users where email = 'paul.ode@example.test'`)).rows[0].id;
    const paulList = (await manager.get('/api/authorisations').query({ holderId: paul })).body.items;
    expect(paulList[0].state, 'a paper record that had run out is history').toBe('lapsed');
  });
});
