import { sql } from 'drizzle-orm';
import type { BenchCase, BenchSuite } from './index.js';
import { seedRegisterHistory } from './register-data.js';

const SCOPES = 20;

/**
 * 100,000 authorisations with their history (renewals, suspensions, restorations, revocations, lapses)
 * over the people suite's 10,000 people and 50 sites; then the register now and at a past moment, the
 * matrix, the person record, the overview, a site's CSV and the reminder sweep, through the real app.
 */
export const registerSuite: BenchSuite = async (ctx) => {
  const { deps, http, clock, services } = ctx;
  const counts = await seedRegisterHistory(deps.db, clock.now(), SCOPES, ctx.analyze);
  const scale = `${Math.round(counts.authorisations / 1000)}k auth., ${Math.round(counts.periods / 1000)}k periods, ${Math.round(counts.events / 1000)}k events`;
  const [site] = (await deps.db.execute(sql`select id from sites where code = 'S-7'`)).rows as { id: string }[];
  const [holder] = (await deps.db.execute(sql`select holder_id as id from authorisations group by holder_id order by count(*) desc, holder_id limit 1`)).rows as { id: string }[];
  const [auth] = (await deps.db.execute(sql`select authorisation_id as id from authorisation_periods where origin = 'renewed' order by id limit 1`)).rows as { id: string }[];
  const past = '2025-09-01T10:00:00Z';

  // The first sweep over the history, phase by phase: it records every lapse and plans and sends every reminder due.
  const secs = (t: number) => ((performance.now() - t) / 1000).toFixed(1);
  const t0 = performance.now();
  const reevaluated = await services.reminders.recordDue();
  const t1 = performance.now();
  const planned = await services.reminders.plan();
  const t2 = performance.now();
  const delivered = await services.reminders.deliver();
  console.log(`[bench] first reminder sweep: ${secs(t0)} s: ${reevaluated} people re-decided in ${((t1 - t0) / 1000).toFixed(1)} s, ` +
    `${planned} sends planned in ${((t2 - t1) / 1000).toFixed(1)} s, ${delivered.sent} sent in ${secs(t2)} s`);

  const ok = (r: { status: number; body?: unknown }) => {
    if (r.status !== 200) throw new Error(`status ${r.status}: ${JSON.stringify(r.body).slice(0, 300)}`);
  };
  const get = (path: string, query: Record<string, string | number> = {}) => async () => ok(await http.get(path).query(query));
  const target = 'tens of ms';
  const cases: BenchCase[] = [
    { name: 'register now, page 1', scale, target, run: get('/api/register', { pageSize: 25 }) },
    { name: 'register now, in force + live work', scale, target, run: get('/api/register', { pageSize: 25, state: 'active', liveWork: 'true' }) },
    { name: 'register now, one site, page 3', scale, target, run: get('/api/register', { pageSize: 25, page: 3, siteId: site.id }) },
    { name: 'register now, by expiry', scale, target, run: get('/api/register', { pageSize: 25, sort: 'expiry' }) },
    { name: 'register at a past moment, page 1', scale, target, run: get('/api/register', { pageSize: 25, at: past }) },
    { name: 'register at a past moment, in force + live work', scale, target, run: get('/api/register', { pageSize: 25, at: past, state: 'active', liveWork: 'true' }) },
    { name: 'register at a past moment, as recorded then', scale, target, run: get('/api/register', { pageSize: 25, at: past, view: 'known' }) },
    { name: 'register, one site, suspended, past moment', scale, target, run: get('/api/register', { pageSize: 25, at: past, siteId: site.id, state: 'suspended' }) },
    { name: 'evidence behind a row', scale, target, run: get(`/api/register/${auth.id}/evidence`) },
    { name: 'matrix, one site, past moment', scale, target, run: get('/api/matrix', { siteId: site.id, at: past }) },
    { name: 'matrix, everyone, page 1', scale, target, run: get('/api/matrix') },
    { name: 'person record', scale, target, run: get(`/api/people/${holder.id}/record`) },
    { name: 'overview, whole organisation', scale, run: get('/api/overview'), runs: 5 },
    { name: 'register CSV, one site (streamed)', scale, run: get('/api/register/export.csv', { siteId: site.id }), runs: 5 },
    { name: 'reminder sweep, steady state', scale, target: 'seconds, not minutes', run: () => services.reminders.sweep(), runs: 1 },
    // Each run is the next day's sweep: that day's lapses recorded, reminders planned and mailed.
    { name: 'reminder sweep, each next day', scale, target: 'seconds, not minutes', run: () => (clock.advance(86_400_000), services.reminders.sweep()), runs: 3 },
  ];
  return cases;
};
