import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { oneRoleAgents } from '../support/role-users.js';
import { ROLES, type Role } from '../../shared/roles.js';
import type { RouteDef } from '../../server/routing.js';
import type { MatrixRows } from './matrix/types.js';
import { acceptedSpellings, refusedSpellings } from '../support/id-spellings.js';

// Every feature adds its rows in a file of its own under ./matrix/.
const files = import.meta.glob<{ rows: MatrixRows }>('./matrix/*.ts', { eager: true });
const matrix: MatrixRows = Object.assign({}, ...Object.values(files).map((f) => f.rows ?? {}));

let t: TestApp;
let users: Awaited<ReturnType<typeof oneRoleAgents>>;
const agents = new Map<Role, Awaited<ReturnType<typeof users.signInAs>>>();
// Letters in it, so its upper-case and mixed-case spellings differ from it (see the spelling test below).
const FAKE_ID = '00000000-0000-4000-8000-00000000fade';

beforeAll(async () => {
  t = await makeTestApp();
  users = await oneRoleAgents(t);
});

const keyOf = (r: RouteDef) => `${r.method.toUpperCase()} ${r.path}`;
const urlOf = (r: RouteDef, id = FAKE_ID) => '/api' + r.path.replace(/:[a-zA-Z]+/g, encodeURIComponent(id));

async function agentFor(role: Role) {
  if (!agents.has(role)) agents.set(role, await users.signInAs(role));
  return agents.get(role)!;
}

async function call(agent: ReturnType<TestApp['agent']>, r: RouteDef, id = FAKE_ID) {
  const req = agent[r.method](urlOf(r, id));
  return r.method === 'get' || r.method === 'delete' ? req : req.send({});
}

describe('permission matrix', () => {
  it('when a route exists, then it has a row in the matrix (and every row names a route)', () => {
    const keys = (t.routeTable as RouteDef[]).map(keyOf);
    expect(keys.filter((k) => !(k in matrix))).toEqual([]);
    expect(Object.keys(matrix).filter((k) => !keys.includes(k))).toEqual([]);
  });

  it('when signed out, then every non-public route answers 401', async () => {
    for (const r of t.routeTable as RouteDef[]) {
      if (matrix[keyOf(r)] === 'public') continue;
      const res = await call(t.agent(), r);
      expect.soft(res.status, `${keyOf(r)} signed out`).toBe(401);
    }
  });

  it('when signed in with one role, then each route is allowed or refused with 403 exactly as the matrix says', async () => {
    for (const r of t.routeTable as RouteDef[]) {
      const row = matrix[keyOf(r)];
      for (const role of ROLES) {
        const allowed = row === 'public' || row === 'signed-in' || row.includes(role);
        const res = await call(await agentFor(role), r);
        if (r.method === 'delete' && r.path === '/session') agents.delete(role);
        if (allowed) expect.soft([401, 403], `${keyOf(r)} as ${role}: ${res.status} ${JSON.stringify(res.body)}`).not.toContain(res.status);
        else expect.soft(res.status, `${keyOf(r)} as ${role}`).toBe(403);
      }
    }
  }, 120_000); // every route five times, PDF exports among them

  // Ids are parsed once at the boundary: every accepted spelling of an id reaches the same answer, and the
  // spellings PostgreSQL would read but the API does not take are refused before any handler runs.
  it('when a route is called with its ids in another accepted spelling, then it answers as with the lower-case one; refused spellings get 400 naming the param', async () => {
    const [lower, ...others] = acceptedSpellings(FAKE_ID);
    for (const r of (t.routeTable as RouteDef[]).filter((d) => /:[a-zA-Z]+/.test(d.path))) {
      const row = matrix[keyOf(r)];
      for (const role of ROLES) {
        const agent = await agentFor(role);
        const expected = (await call(agent, r, lower)).status;
        // Never an unexpected failure (the job queue's deliberate 503 where it does not run is not one).
        expect.soft(expected, `${keyOf(r)} as ${role}`).not.toBe(500);
        for (const id of others) expect.soft((await call(agent, r, id)).status, `${keyOf(r)} as ${role} with ${id}`).toBe(expected);
      }
      if (r.path.includes(':code')) continue; // a certificate code, not an id
      // Access is checked before input (the test above): a role that gets past it sees the 400.
      const role = row === 'public' || row === 'signed-in' ? ROLES[0] : row[0];
      for (const id of refusedSpellings(FAKE_ID)) {
        const res = await call(await agentFor(role), r, id);
        expect.soft(res.status, `${keyOf(r)} as ${role} with ${id}`).toBe(400);
        expect.soft(Object.keys(res.body.error?.fields ?? {})[0], `${keyOf(r)} names the param`).toMatch(/^params\./);
      }
    }
  }, 120_000); // about a thousand requests
});
