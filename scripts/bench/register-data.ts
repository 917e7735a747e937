import { sql } from 'drizzle-orm';
import type { Database } from '../../server/db/client.js';

// A verification code in the certificate's alphabet (A–Z, 2–7) from random hex.
const code = sql.raw(`translate(upper(md5(random()::text || clock_timestamp()::text)), '0189', 'WXYZ')`);
const q = (db: Database, s: ReturnType<typeof sql>) => db.execute(s);

/**
 * The history, written in set-based statements: each person holds about half of the scopes; a first period
 * began some time in the last two years and ran a year; most that ended were renewed; some were suspended
 * (and most of those put right), a few revoked, and the rest of the ended ones lapsed.
 */
export async function seedRegisterHistory(db: Database, now: Date, scopes: number, analyze: () => Promise<void>) {
  const t = sql`${now.toISOString()}::timestamptz`;
  const [admin] = (await db.execute(sql`select id, name from users where email = 'person1@bench.invalid'`)).rows as { id: string; name: string }[];
  await q(db, sql`insert into scopes (code, title, description, max_voltage_v, max_current_a, allows_live_work, validity_months, reminder_offsets_days, certificate_grace_days, active, created_at, updated_at, redecided_at)
    select 'B-' || lpad(g::text, 2, '0'), 'Bench scope ' || g, '', 250, 10, g % 2 = 0, 12, '{30,7}', 0, true, ${t}, ${t}, ${t} from generate_series(1, ${scopes}) g`);
  await q(db, sql`update users set created_at = ${t} - interval '3 years'`);
  // The people suite made one person in ten a manager (twenty per site, and every reminder goes to each of them);
  // a workshop has two or so: the rest become technicians, so the sweep mails as many people as it would for real.
  await q(db, sql`with ranked as (select r.user_id, row_number() over (partition by u.site_id order by u.email) as n
      from user_roles r join users u on u.id = r.user_id where r.role = 'manager')
    update user_roles set role = 'technician' where role = 'manager' and user_id in (select user_id from ranked where n > 2)`);
  await q(db, sql`insert into authorisations (holder_id, scope_id, created_at)
    select u.id, s.id, ${t} - interval '2 years' from users u cross join scopes s
    where s.code like 'B-%' and abs(hashtext(u.id::text || s.id::text)) % 2 = 0`);
  // random() in a CTE's select list is drawn per row (in a lateral without outer references it would be drawn once).
  await q(db, sql`with x as (select a.*, ${t} - random() * interval '700 days' as st from authorisations a)
    insert into authorisation_periods (authorisation_id, holder_id, scope_id, starts_at, ends_at, validity_ends_at, origin, verification_code, evidence_snapshot, recorded_at)
    select x.id, x.holder_id, x.scope_id, st, st + interval '365 days', st + interval '365 days', 'issued', ${code},
      jsonb_build_object('evaluatedAt', st, 'completedBy', null, 'requirements', '[]'::jsonb), st from x`);
  await q(db, sql`insert into authorisation_periods (authorisation_id, holder_id, scope_id, starts_at, ends_at, validity_ends_at, origin, previous_period_id, verification_code, evidence_snapshot, recorded_at)
    select p.authorisation_id, p.holder_id, p.scope_id, p.ends_at, p.ends_at + interval '365 days', p.ends_at + interval '365 days', 'renewed', p.id, ${code},
      jsonb_build_object('evaluatedAt', p.ends_at, 'completedBy', null, 'requirements', '[]'::jsonb), p.ends_at
    from authorisation_periods p where p.ends_at < ${t} and random() < 0.7`);
  await q(db, sql`insert into authorisation_events (period_id, kind, effective_at, recorded_at, details)
    select id, origin, starts_at, starts_at, '{}'::jsonb from authorisation_periods`);
  await q(db, sql`insert into authorisation_events (period_id, kind, effective_at, recorded_at, reason, cause)
    select id, 'suspended', starts_at + interval '30 days', starts_at + interval '31 days', 'The first aid and CPR certificate ran out.', 'certificate:first_aid_cpr'
    from authorisation_periods where random() < 0.08 and starts_at + interval '31 days' < ${t}`);
  await q(db, sql`insert into authorisation_events (period_id, kind, effective_at, recorded_at, reason, cause)
    select period_id, 'restored', effective_at + interval '10 days', effective_at + interval '10 days', null, cause
    from authorisation_events where kind = 'suspended' and random() < 0.6 and effective_at + interval '10 days' < ${t}`);
  const [sig] = (await db.execute(sql`insert into signatures (signer_id, printed_name, meaning, entity, entity_id, signed_at)
    values (${admin.id}, ${admin.name}, 'Revoked this authorisation', 'bench', 'revocations', ${t}) returning id`)).rows as { id: string }[];
  await q(db, sql`with r as (
      select p.id, p.starts_at + interval '60 days' as at from authorisation_periods p
      where random() < 0.03 and p.starts_at + interval '60 days' < least(p.ends_at, ${t})
        and not exists (select 1 from authorisation_periods n where n.previous_period_id = p.id)),
    e as (insert into authorisation_events (period_id, kind, effective_at, recorded_at, actor_id, reason, signature_id)
      select id, 'revoked', at, at, ${admin.id}, 'Worked live without the second person.', ${sig.id} from r returning period_id)
    update authorisation_periods p set ends_at = r.at from r where p.id = r.id`);
  await q(db, sql`insert into authorisation_events (period_id, kind, effective_at, recorded_at, reason)
    select p.id, 'lapsed', p.ends_at, p.ends_at + interval '1 hour', 'It reached the end of its validity.' from authorisation_periods p
    where p.ends_at + interval '1 hour' < ${t}
      and not exists (select 1 from authorisation_events e where e.period_id = p.id and e.kind in ('revoked', 'lapsed'))
      and not exists (select 1 from authorisation_periods n where n.previous_period_id = p.id)`);
  await analyze();
  const [c] = (await db.execute(sql`select (select count(*) from authorisations)::int as authorisations,
    (select count(*) from authorisation_periods)::int as periods, (select count(*) from authorisation_events)::int as events`)).rows as { authorisations: number; periods: number; events: number }[];
  return c;
}
