import { sql } from 'drizzle-orm';
import { hashPassword } from '../../server/auth/password.js';
import type { BenchSuite } from './index.js';

const PEOPLE = 10_000;
const SITES = 50;

/** 10,000 people over 50 sites (the design scale), then the people table as an admin and a manager. */
export const peopleSuite: BenchSuite = async ({ deps, http, clock, analyze }) => {
  const hash = await hashPassword('bench person password 1');
  const now = clock.now().toISOString();
  await deps.db.execute(sql`insert into sites (code, name, time_zone, person_term, created_at)
    select 'S-' || g, 'Bench site ' || g, 'Europe/Berlin', 'skilled person', ${now}::timestamptz from generate_series(1, ${SITES}) g`);
  await deps.db.execute(sql`insert into users (email, name, site_id, password_hash, active, created_at, updated_at)
    select 'person' || g || '@bench.invalid', 'Person ' || lpad(g::text, 5, '0') || ' ' || md5(g::text), s.id, ${hash}, true, ${now}::timestamptz, ${now}::timestamptz
    from generate_series(1, ${PEOPLE}) g join (select id, row_number() over (order by code) - 1 as n from sites) s on s.n = g % ${SITES}`);
  await deps.db.execute(sql`insert into user_roles (user_id, role)
    select id, case when random() < 0.8 then 'technician' when random() < 0.5 then 'assessor' else 'manager' end from users`);
  await deps.db.execute(sql`insert into user_roles (user_id, role) select id, 'admin' from users where email = 'person1@bench.invalid'`);
  await analyze();
  const res = await http.post('/api/session').send({ email: 'person1@bench.invalid', password: 'bench person password 1' });
  if (res.status !== 200) throw new Error(`bench sign-in failed: ${res.status}`);
  const someone = (await http.get('/api/people').query({ q: 'Person 04242' })).body.items[0].id;
  const scale = `${PEOPLE} people, ${SITES} sites`;
  const ok = (r: { status: number }) => {
    if (r.status !== 200) throw new Error(`status ${r.status}`);
  };
  return [
    { name: 'people table, page 1 by name', scale, target: 'tens of ms', run: async () => ok(await http.get('/api/people').query({ pageSize: 25 })) },
    { name: 'people table, page 200 by site', scale, target: 'tens of ms', run: async () => ok(await http.get('/api/people').query({ pageSize: 25, page: 200, sort: 'site' })) },
    { name: 'people table, search by name', scale, target: 'tens of ms', run: async () => ok(await http.get('/api/people').query({ q: 'Person 07' })) },
    { name: 'people table, filter by role', scale, target: 'tens of ms', run: async () => ok(await http.get('/api/people').query({ role: 'assessor' })) },
    { name: 'person record', scale, target: 'tens of ms', run: async () => ok(await http.get(`/api/people/${someone}`)) },
  ];
};
