import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { z } from 'zod';
import { makeTestApp, type TestApp } from '../support/app.js';
import { keepSignedIn, startWalker, walk, type Who } from '../support/route-walk.js';
import type { RouteDef } from '../../server/routing.js';
import type { Role } from '../../shared/roles.js';
import type { MatrixRows } from './matrix/types.js';

let t: TestApp;
let stop: () => Promise<void>;
beforeAll(async () => {
  t = await makeTestApp();
  stop = await startWalker(t);
});
afterAll(() => stop?.());

const files = import.meta.glob<{ rows: MatrixRows }>('./matrix/*.ts', { eager: true });
const matrix: MatrixRows = Object.assign({}, ...Object.values(files).map((f) => f.rows ?? {}));

/** An admin and a manager on every route; where neither gets past the access check, also a role that does, so the input reaches the handler. */
function plan(r: RouteDef): [Who, number][] {
  const row = matrix[`${r.method.toUpperCase()} ${r.path}`];
  const may = (who: Who) => row === 'public' || row === 'signed-in' || (row ?? []).includes(who as Role);
  const steps: [Who, number][] = [['admin', may('admin') ? 6 : 1], ['manager', may('manager') ? 4 : 1]];
  const other = (['assessor', 'technician', 'auditor'] as const).find(may);
  if (!may('admin') && !may('manager') && other) steps.push([other, 6]);
  return steps;
}

describe('hostile input on every route', () => {
  it('when every route gets generated bodies, queries and ids with hostile values, then none answers 5xx, and a refused write changes no row and adds no audit entry', async () => {
    const failures: string[] = [];
    for (const r of t.routeTable as RouteDef[]) {
      for (const [who, runs] of plan(r)) {
        const failure = await walk(r, who, runs);
        if (failure) failures.push(failure);
        await keepSignedIn(who);
      }
    }
    expect(failures).toEqual([]);
  }, 240_000);

  // The walk can fail: with one route's schema loosened to a bare string for the name, it finds the 500 that
  // a NUL byte causes where the name is stored (the route table is read on each request, so this is the app as served).
  it('when a route takes any string for a name, then the walk reports a 5xx on it', async () => {
    const route = (t.routeTable as RouteDef[]).find((r) => r.method === 'patch' && r.path === '/people/:id')!;
    const schema = route.body;
    route.body = z.object({ name: z.string() }).strict();
    try {
      expect(await walk(route, 'admin', 60, 20261203)).toMatch(/^admin PATCH \/people\/:id \(seed 20261203\): 500 /);
    } finally {
      route.body = schema;
    }
  }, 60_000);
});
