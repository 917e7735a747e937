import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { buildRegisterScenario, type RegisterScenario } from '../support/register.js';
import { stateAt } from '../../server/authorisations/index.js';

let t: TestApp;
let s: RegisterScenario;
let auditor: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  s = await buildRegisterScenario(t);
  auditor = await signIn(t, DEMO.auditor);
});

type Letter = 'a' | 'b' | 'c' | 'd' | 'e' | 'f';
const LETTERS: Letter[] = ['a', 'b', 'c', 'd', 'e', 'f'];

async function registerAt(at: string, extra: Record<string, string> = {}) {
  const res = await auditor.get('/api/register').query({ scopeId: s.scope.id, at, pageSize: 50, ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const byPerson = new Map(LETTERS.map((l) => [s.people[l].id, l]));
  return Object.fromEntries((res.body.items as { person: { id: string }; state: string }[]).map((r) => [byPerson.get(r.person.id), r.state]));
}

// What the register must say at each instant (effective-time view), person by person; absent = not listed.
const EXPECTED: [string, Partial<Record<Letter, string>>][] = [
  ['2026-03-01T12:00:00Z', { f: 'active' }],
  ['2026-03-05T12:00:00Z', { a: 'active', b: 'active', c: 'active', d: 'active', f: 'active' }],
  ['2026-03-11T12:00:00Z', { a: 'active', b: 'suspended', c: 'active', d: 'active', f: 'active' }],
  ['2026-03-13T12:00:00Z', { a: 'active', b: 'active', c: 'active', d: 'active', f: 'active' }],
  ['2026-03-16T12:00:00Z', { a: 'active', b: 'active', c: 'active', d: 'revoked', f: 'active' }],
  ['2026-03-21T12:00:00Z', { a: 'active', b: 'active', c: 'suspended', d: 'revoked', f: 'active' }],
  ['2026-03-26T12:00:00Z', { a: 'active', b: 'active', c: 'suspended', d: 'revoked', e: 'active', f: 'active' }],
  ['2026-06-05T11:00:00Z', { a: 'lapsed', b: 'lapsed', c: 'lapsed', d: 'revoked', e: 'active', f: 'active' }],
];

describe('the register at a past moment', () => {
  it('when read at each instant of the scenario, then it lists exactly the right people in the right state', async () => {
    for (const [at, expected] of EXPECTED) expect(await registerAt(at), at).toEqual(expected);
  });

  it('when read at each instant, then every row agrees with stateAt, the authorisations feature’s own fold', async () => {
    for (const [at] of EXPECTED) {
      const listed = await registerAt(at);
      for (const l of LETTERS) {
        const derived = await stateAt(t.deps.db, { authorisationId: s.ids[l] }, new Date(at));
        expect(listed[l] ?? 'none', `${l} at ${at}`).toBe(derived.state);
      }
    }
  });

  it('when read exactly at each recorded change and a millisecond either side, then the register still agrees with stateAt', async () => {
    const moments = (await t.ownerQuery(
      `select distinct m from (select e.effective_at as m from authorisation_events e join authorisation_periods p on p.id = e.period_id where p.scope_id = $1
        union select ends_at from authorisation_periods where scope_id = $1 union select starts_at from authorisation_periods where scope_id = $1) x where m <= $2`,
      [s.scope.id, t.clock.now()],
    )).rows.map((r) => (r.m as Date).getTime());
    expect(moments.length).toBeGreaterThanOrEqual(8);
    for (const m of moments) {
      for (const at of [m - 1, m, m + 1].map((x) => new Date(x).toISOString())) {
        const listed = await registerAt(at);
        for (const l of LETTERS) expect(listed[l] ?? 'none', `${l} at ${at}`).toBe((await stateAt(t.deps.db, { authorisationId: s.ids[l] }, new Date(at))).state);
      }
    }
  });

  it('when filtered to live work in force, then only those in force at that moment are listed', async () => {
    expect(await registerAt('2026-03-11T12:00:00Z', { state: 'active', liveWork: 'true' })).toEqual({ a: 'active', c: 'active', d: 'active', f: 'active' });
    expect(await registerAt('2026-03-11T12:00:00Z', { state: 'active', liveWork: 'false' })).toEqual({});
    expect(await registerAt('2026-03-11T12:00:00Z', { personId: s.people.b.id })).toEqual({ b: 'suspended' });
  });

  it('when read as recorded by then, then later records (a paper record, a suspension the sweep noted afterwards) are left out', async () => {
    expect(await registerAt('2026-03-01T12:00:00Z', { view: 'known' })).toEqual({});
    expect(await registerAt('2026-03-21T12:00:00Z', { view: 'known' }), 'the sweep noted C on 22 Mar').toEqual({ a: 'active', b: 'active', c: 'active', d: 'revoked' });
    expect(await registerAt('2026-03-22T09:00:00Z', { view: 'known' })).toMatchObject({ c: 'suspended' });
    expect(await registerAt('2026-03-27T12:00:00Z', { view: 'known' })).toMatchObject({ e: 'active', f: 'active' });
    const known = await auditor.get('/api/register').query({ scopeId: s.scope.id, at: '2026-03-21T12:00:00Z', view: 'known', pageSize: 2 });
    expect(known.body.total, 'the count follows the same reading').toBe(4);
  });

  it('when an end was moved later (a revocation), then "as recorded then" shows the end known at that moment', async () => {
    const row = async (view: string) => (await auditor.get('/api/register').query({ personId: s.people.d.id, at: '2026-03-11T12:00:00Z', view })).body.items[0];
    expect(await row('effective')).toMatchObject({ state: 'active', validUntil: '2026-03-15' });
    expect(await row('known')).toMatchObject({ state: 'active', validUntil: '2026-06-02' });
  });

  it('when a row is shown, then it carries the dates of the period then, in the holder’s local days', async () => {
    const res = await auditor.get('/api/register').query({ scopeId: s.scope.id, at: '2026-03-11T12:00:00Z', personId: s.people.b.id });
    expect(res.body).toMatchObject({ at: '2026-03-11T12:00:00.000Z', view: 'effective', isNow: false, total: 1 });
    expect(res.body.items[0]).toMatchObject({ state: 'suspended', stateLabel: 'Suspended', since: '2026-03-10T10:00:00.000Z', validFrom: '2026-03-02', validUntil: '2026-06-02' });
  });

  it('when paged, then pages hold the rows in name order and the total counts them all', async () => {
    const first = await auditor.get('/api/register').query({ scopeId: s.scope.id, at: '2026-03-26T12:00:00Z', pageSize: 4, page: 1 });
    const second = await auditor.get('/api/register').query({ scopeId: s.scope.id, at: '2026-03-26T12:00:00Z', pageSize: 4, page: 2 });
    expect([first.body.total, second.body.total]).toEqual([6, 6]);
    const names = [...first.body.items, ...second.body.items].map((r: { person: { name: string } }) => r.person.name);
    expect(names).toEqual(LETTERS.map((l) => s.people[l].name));
    const beyond = await auditor.get('/api/register').query({ scopeId: s.scope.id, pageSize: 4, page: 9 });
    expect(beyond.body).toMatchObject({ items: [], total: 6 });
  });

  it('when asked for a moment still to come or in a wrong form, then it answers 422 or 400 naming "at"', async () => {
    const future = await auditor.get('/api/register').query({ at: '2027-01-01T00:00:00Z' });
    expect(future.status).toBe(422);
    expect(future.body.error.fields).toHaveProperty('at');
    const wrong = await auditor.get('/api/register').query({ at: '5 March' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('query.at');
  });

  it('when a manager of another site reads it, then rows of people they do not cover are not in it', async () => {
    const other = await signIn(t, DEMO.manager2);
    const res = await other.get('/api/register').query({ scopeId: s.scope.id });
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([]);
    const mine = await s.manager.get('/api/register').query({ scopeId: s.scope.id });
    expect(mine.body.total).toBe(6);
  });
});
