import type { TestApp } from './app.js';
import { hashPassword } from '../../server/auth/password.js';
import { insertUser, replaceRoles } from '../../server/people/people.repository.js';
import { listSites } from '../../server/sites/sites.repository.js';
import type { Role } from '../../shared/roles.js';
import type { ScopeInput } from '../../shared/schemas/authorisations.js';
import { signIn } from './people.js';
import type { MineItem } from '../../shared/authorisations/views.js';

export const PERSON_PASSWORD = 'bench-person-for-authorisation-tests';
let counter = 0;

/** A fresh person at a demo site (LEJ-W1 unless told), signed in, so each test starts from a clean record. */
export async function newPerson(t: TestApp, opts: { roles?: Role[]; site?: string; name?: string } = {}) {
  const site = (await listSites(t.deps.db)).find((s) => s.code === (opts.site ?? 'LEJ-W1'))!;
  const now = t.clock.now();
  const n = ++counter;
  const user = await insertUser(t.deps.db, {
    email: `person-${n}-${Math.random().toString(36).slice(2, 8)}@test.invalid`, name: opts.name ?? `Bench Person ${n}`, siteId: site.id,
    passwordHash: await hashPassword(PERSON_PASSWORD), active: true, createdAt: now, updatedAt: now,
  });
  await replaceRoles(t.deps.db, user.id, opts.roles ?? ['technician']);
  const agent = await signIn(t, user.email, PERSON_PASSWORD);
  return Object.assign(agent, { id: user.id, email: user.email, name: user.name, siteId: site.id });
}
export type Person = Awaited<ReturnType<typeof newPerson>>;

let scopeCounter = 0;
/** A scope with a unique code; requirements default to one first-aid certificate. */
export async function makeScope(manager: ReturnType<TestApp['agent']>, body: Partial<ScopeInput> = {}) {
  const res = await manager.post('/api/scopes').send({
    code: `T-${++scopeCounter}-${Math.random().toString(36).slice(2, 6).toUpperCase()}`, title: `Test scope ${scopeCounter}`, maxVoltageV: 250, maxCurrentA: 10,
    allowsLiveWork: false, validityMonths: 12, reminderOffsetsDays: [60, 30, 7], certificateGraceDays: 0,
    requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }], ...body,
  });
  if (res.status !== 201) throw new Error(`scope not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string; code: string; title: string };
}

/** The holder uploads the certificate's details; returns its id (not yet checked). */
export async function submitCertificate(holder: Person, body: { kind?: string; issuedOn: string; expiresOn: string; issuer?: string }) {
  const res = await holder.post('/api/certificates').send({ kind: 'first_aid_cpr', issuer: 'Red Cross Leipzig', reference: 'EH-2026-118', ...body });
  if (res.status !== 201) throw new Error(`certificate not submitted: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as string;
}

/** Signs the check; without a scan on file the manager states they saw the original in the workshop office that day. */
export async function verifyCertificate(manager: ReturnType<TestApp['agent']>, id: string, password: string) {
  const res = await manager.post(`/api/certificates/${id}/verify`).send({ password, ...SAW_ORIGINAL });
  if (res.status !== 200) throw new Error(`certificate not verified: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** The holder's authorisation for one scope, as "What I may do" shows it. */
export async function mineFor(holder: Person, scopeId: string) {
  const res = await holder.get('/api/authorisations/mine');
  return (res.body.items as MineItem[]).find((i) => i.scope.id === scopeId);
}

export const DAY = 86_400_000;
export const SAW_ORIGINAL = { sawOriginal: true, sawOriginalWhere: 'Workshop office, card shown by the holder' };
