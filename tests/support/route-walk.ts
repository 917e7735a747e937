import fc from 'fast-check';
import pg from 'pg';
import type { TestApp } from './app.js';
import { DEMO, DEMO_PASSWORD, signIn } from './people.js';
import { spellingOf } from './id-spellings.js';
import { changedTables, fingerprint } from './fingerprint.js';
import { HOSTILE_RAW, HOSTILE_STRINGS, enc, hostile, hostileMultipart, queryString } from './hostile-values.js';
import { arbitraryFor, type Pools } from './zod-arbitrary.js';
import type { RouteDef } from '../../server/routing.js';

// Which table a field's or a path's id names; the rest draw from every id (a wrong kind is a fair test too).
const FIELD_TABLE: Record<string, string> = {
  holderId: 'users', personId: 'users', userId: 'users', technicianId: 'users', ownerId: 'users', actorId: 'users', siteId: 'sites',
  coveredSiteIds: 'sites', scopeId: 'scopes', procedureId: 'procedures', versionId: 'procedure_versions', from: 'procedure_versions',
  to: 'procedure_versions', benchId: 'benches', instrumentIds: 'instruments', instrumentId: 'instruments', checklistId: 'procedure_checklists',
  evidenceId: 'evidence', authorisationId: 'authorisations', periodId: 'authorisation_periods', stepKey: 'procedure_steps', key: 'procedure_steps',
};
const PATH_TABLE: Record<string, string> = {
  people: 'users', authorisations: 'authorisations', benches: 'benches', certificates: 'external_certificates', evidence: 'evidence',
  findings: 'findings', instruments: 'instruments', mail: 'mail_log', practicals: 'practicals', procedures: 'procedures', scopes: 'scopes',
  signoffs: 'signoffs', sites: 'sites',
};
type Agent = Awaited<ReturnType<typeof signIn>>;
export type Who = 'admin' | 'manager' | 'assessor' | 'technician' | 'auditor';
type Input = { params: unknown; query: unknown; body: unknown; raw: [string, string | Buffer] | null };

const emails: Record<Who, string> = { admin: DEMO.admin, manager: DEMO.manager, assessor: DEMO.assessor, technician: DEMO.technician, auditor: DEMO.auditor };
let t: TestApp;
let owner: pg.Client;
const ids: Record<string, string[]> = {};
const agents = {} as Record<Who, Agent>;

/** Signs in the demo callers and reads the id pools; call once in beforeAll. Returns the owner connection's closer. */
export async function startWalker(app: TestApp) {
  t = app;
  owner = new pg.Client({ connectionString: t.database.ownerUrl });
  await owner.connect();
  const { rows } = await owner.query(`select table_name as t from information_schema.columns where table_schema = 'public' and column_name = 'id' and data_type = 'uuid'`);
  // The callers are left out, so no run switches them off or takes their roles.
  const callers = Object.values(emails);
  for (const { t: table } of rows) ids[table] = (await owner.query(`select id::text from "${table}" where id::text not in (select id::text from users where email = any($1)) order by id limit 12`, [callers])).rows.map((r) => r.id);
  ids.procedure_steps = (await owner.query('select key::text as k from procedure_steps limit 12')).rows.map((r) => r.k);
  for (const who of Object.keys(emails) as Who[]) agents[who] = await signIn(t, emails[who]);
  return () => owner.end();
}

function idArb(table: string | undefined): fc.Arbitrary<string> {
  const pool = (table && ids[table]?.length ? ids[table] : Object.values(ids).flat()).slice(0, 40);
  return fc.tuple(fc.constantFrom(...pool), fc.nat(2)).map(([id, n]) => spellingOf(id, n));
}
const pools = (path: string): Pools => ({
  idFor: (field) => idArb(FIELD_TABLE[field] ?? (field === 'id' ? PATH_TABLE[path.split('/')[1]] : undefined)),
  password: DEMO_PASSWORD,
});

function inputFor(r: RouteDef): fc.Arbitrary<Input> {
  const p = pools(r.path);
  const names = [...r.path.matchAll(/:([a-zA-Z]+)/g)].map((m) => m[1]);
  const params = r.params ? arbitraryFor(r.params, p) : fc.constant({});
  const query = r.query ? arbitraryFor(r.query, p) : fc.option(fc.dictionary(fc.constantFrom('q', 'page', 'x'), hostile, { maxKeys: 2 }), { nil: {} });
  const body = r.body ? arbitraryFor(r.body, p) : fc.oneof(fc.constant({}), hostile);
  const raw: fc.Arbitrary<[string, string | Buffer] | null> = r.before
    ? fc.constantFrom(...HOSTILE_STRINGS.slice(0, 12)).chain((f) => fc.constantFrom(...hostileMultipart(f)))
    : fc.oneof({ weight: 6, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: fc.constantFrom(...HOSTILE_RAW) });
  return fc.record({ params, query, body, raw }).map((i) => ({ ...i, params: names.length ? i.params : {} }));
}

function urlOf(r: RouteDef, i: Input): string {
  const params = (i.params && typeof i.params === 'object' ? i.params : {}) as Record<string, unknown>;
  const text = (v: unknown) => (v !== null && typeof v === 'object' ? JSON.stringify(v) : String(v));
  const path = r.path.replace(/:([a-zA-Z]+)/g, (_, n) => enc(text(params[n] ?? i.params ?? 'x')) || '%20');
  const qs = i.query && typeof i.query === 'object' ? queryString(i.query as Record<string, unknown>) : `x=${enc(String(i.query))}`;
  return `/api${path}${qs ? `?${qs}` : ''}`;
}

async function send(agent: Agent, r: RouteDef, i: Input) {
  const req = agent[r.method](urlOf(r, i));
  if (r.method === 'get') return req;
  if (i.raw) return req.set('Content-Type', i.raw[0]).send(i.raw[1]);
  return i.body !== null && typeof i.body === 'object' ? req.send(i.body as object) : req.set('Content-Type', 'application/json').send(JSON.stringify(i.body ?? null));
}

/** Signs the caller in again when a run signed it out or in as someone else (sign-in, sign-out and session routes are walked too). */
export async function keepSignedIn(who: Who) {
  const me = await agents[who].get('/api/session');
  if (me.status === 200 && me.body.email === emails[who]) return;
  await owner.query('update users set failed_sign_ins = 0, locked_until = null where email = $1', [emails[who]]);
  agents[who] = await signIn(t, emails[who]);
}

/** Runs the property on one route as one caller; a failure is returned as one line (route, seed, what, input), or null. */
export async function walk(r: RouteDef, who: Who, numRuns: number, seed?: number): Promise<string | null> {
  const property = fc.asyncProperty(inputFor(r), async (i) => {
    const before = r.method === 'get' ? null : await fingerprint(t, (q) => owner.query(q));
    const res = await send(agents[who], r, i);
    const deliberate = res.status === 503 && res.body?.error?.code === 'jobs_not_running';
    if (res.status >= 500 && !deliberate) throw new Error(`${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
    if (before && res.status >= 400) {
      const changed = changedTables(before, await fingerprint(t, (q) => owner.query(q)));
      if (changed.length) throw new Error(`refused with ${res.status} but wrote ${changed.join(', ')}`);
    }
    if (res.status < 400 && r.method !== 'get') await keepSignedIn(who);
  });
  const details = await fc.check(property, { numRuns, endOnFailure: true, seed });
  if (!details.failed) return null;
  const input = JSON.stringify(details.counterexample?.[0]).slice(0, 600);
  return `${who} ${r.method.toUpperCase()} ${r.path} (seed ${details.seed}): ${(details.errorInstance as Error)?.message} for ${input}`;
}
