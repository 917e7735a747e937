import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import fc from 'fast-check';
import pg from 'pg';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO_PASSWORD, signIn } from '../support/people.js';
import { spellingOf } from '../support/id-spellings.js';
import { ROLES, type Role } from '../../shared/roles.js';
import { makeWorld, type WorldPerson } from '../support/people-world.js';

// The rules, written out here on their own (not read from shared/abilities.ts):
// - of your own record you change the name only;
// - an admin changes anyone else, with any role and any site;
// - a manager changes only people of a site they cover who hold none of manager, auditor, admin, and gives
//   only technician and assessor, and only sites they cover (own site or covered);
// - nobody else changes anyone else.
const ADMIN_ONLY: Role[] = ['manager', 'auditor', 'admin'];
function allowed(actor: WorldPerson, target: WorldPerson, body: Record<string, unknown>): boolean {
  if (actor.id === target.id) return Object.keys(body).every((k) => k === 'name');
  if (actor.roles.includes('admin')) return true;
  if (!actor.roles.includes('manager')) return false;
  const covers = (siteId: string) => actor.siteIds.includes(siteId);
  if (!covers(target.siteId) || target.roles.some((r) => ADMIN_ONLY.includes(r))) return false;
  if ((body.roles as Role[] | undefined)?.some((r) => ADMIN_ONLY.includes(r))) return false;
  if (typeof body.siteId === 'string' && !covers(body.siteId)) return false;
  return ((body.coveredSiteIds as string[] | undefined) ?? []).every(covers);
}

let t: TestApp;
let owner: pg.Client;
let world: Awaited<ReturnType<typeof makeWorld>>;
const agents = new Map<string, Awaited<ReturnType<typeof signIn>>>();

beforeAll(async () => {
  t = await makeTestApp();
  owner = new pg.Client({ connectionString: t.database.ownerUrl });
  await owner.connect();
  world = await makeWorld(t, owner);
});
afterAll(async () => owner.end());

async function agentOf(p: WorldPerson) {
  if (!agents.has(p.id)) agents.set(p.id, await signIn(t, p.email, DEMO_PASSWORD));
  return agents.get(p.id)!;
}

// One or two fields per change, so a change is often within reach and the rules that remain are the ones tried.
const FIELDS = ['name', 'roles', 'siteId', 'coveredSiteIds', 'accessEndsOn', 'active'] as const;
const arbChange = (siteIds: string[]) => fc.record({
  fields: fc.uniqueArray(fc.constantFrom(...FIELDS), { minLength: 1, maxLength: 2 }),
  name: fc.constantFrom('Renamed Person', 'Ada Example'),
  roles: fc.oneof(fc.subarray<Role>(['technician', 'assessor'], { minLength: 1 }), fc.subarray([...ROLES], { minLength: 1 })),
  siteId: fc.constantFrom(...siteIds),
  coveredSiteIds: fc.subarray(siteIds),
  accessEndsOn: fc.constantFrom(null, '2026-09-30', '2027-01-31'),
  active: fc.boolean(),
}).map(({ fields, ...v }) => {
  const body: Partial<typeof v> & { deactivatedReason?: string } = Object.fromEntries(fields.map((f) => [f, v[f]]));
  if (body.active === false) body.deactivatedReason = 'Moved to another employer';
  return body;
});

describe('PATCH /api/people/:id over random actors, targets, changes and id spellings', () => {
  it('when anyone sends any change, then it is applied exactly when the rules allow it, and a refused one changes no row', async () => {
    const keys = world.people.map((p) => p.key);
    const managers = keys.filter((k) => world.person(k).roles.includes('manager'));
    const admins = keys.filter((k) => world.person(k).roles.includes('admin'));
    const adminOnly = keys.filter((k) => world.person(k).roles.some((r) => ADMIN_ONLY.includes(r)));
    // Weighted towards the actors and targets the rules are about; everyone still comes up.
    const arb = fc.record({
      actor: fc.oneof({ arbitrary: fc.constantFrom(...managers), weight: 2 }, { arbitrary: fc.constantFrom(...admins), weight: 1 }, { arbitrary: fc.constantFrom(...keys), weight: 2 }),
      target: fc.oneof({ arbitrary: fc.constant('self'), weight: 1 }, { arbitrary: fc.constantFrom(...adminOnly), weight: 1 }, { arbitrary: fc.constantFrom(...keys), weight: 2 }),
      body: arbChange(world.siteIds),
      spell: fc.nat(),
    });
    await fc.assert(fc.asyncProperty(arb, async ({ actor: a, target: tk, body, spell }) => {
      const actor = world.person(a);
      const target = tk === 'self' ? actor : world.person(tk);
      const sent = { ...body, ...(body.siteId ? { siteId: spellingOf(body.siteId, spell) } : {}), ...(body.coveredSiteIds ? { coveredSiteIds: body.coveredSiteIds.map((s, i) => spellingOf(s, spell + i)) } : {}) };
      const agent = await agentOf(actor); // a sign-in first: it writes the audit trail, so before the snapshot
      const before = await world.snapshot(target.id);
      const res = await agent.patch(`/api/people/${spellingOf(target.id, spell + 1)}`).send(sent);
      const expected = allowed(actor, target, body);
      const why = `${a} → ${tk} ${JSON.stringify(sent)}: ${res.status} ${JSON.stringify(res.body)}`;
      if (!expected) {
        expect(res.status, why).toBe(403);
        expect(Object.keys(res.body.error.fields ?? {}), why).toHaveLength(1);
        expect(await world.snapshot(target.id), why).toEqual(before);
        return;
      }
      expect(res.status, why).toBe(200);
      const after = await world.snapshot(target.id);
      if (body.siteId) expect(after.row.site_id, why).toBe(body.siteId);
      if (body.roles) expect(after.roles, why).toEqual([...body.roles].sort());
      if (body.coveredSiteIds) expect(after.covered, why).toEqual(body.coveredSiteIds.filter((s) => s !== after.row.site_id).sort());
      if (body.active !== undefined) expect(after.row.active, why).toBe(body.active);
      await world.restore(target.id, before);
      if (body.active === false) agents.delete(target.id);
    }), { numRuns: 100 });
  });
});
