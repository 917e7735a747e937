import type pg from 'pg';
import type { TestApp } from './app.js';
import { DEMO } from './people.js';
import type { Role } from '../../shared/roles.js';

export interface WorldPerson {
  key: string;
  id: string;
  email: string;
  roles: Role[];
  siteId: string;
  /** Own site plus covered sites. */
  siteIds: string[];
}

type Extra = { key: string; site: string; roles: Role[]; covers?: string[] };

/**
 * The demo people plus a third site with its own manager, technician and assessor, and a second admin,
 * so every kind of actor and target exists: self, admins, an auditor, managers of other sites, people of
 * sites a manager does not cover. New people get the demo password. `owner` is a database-owner client.
 */
export async function makeWorld(t: TestApp, owner: pg.Client) {
  const q = async (text: string, params: unknown[] = []) => (await owner.query(text, params)).rows;
  const site = async (code: string) => (await q('select id from sites where code = $1', [code]))[0].id as string;
  const s1 = await site('LEJ-W1');
  const s2 = await site('CLE-L2');
  const [{ id: s3 }] = await q(`insert into sites (code, name, time_zone, person_term, created_at) values ('THR-3', 'Third site', 'UTC', 'skilled person', now()) returning id`);
  const [{ password_hash: hash }] = await q('select password_hash from users where email = $1', [DEMO.admin]);
  const extras: Extra[] = [
    { key: 'admin2', site: s2, roles: ['admin'] },
    { key: 'managerC', site: s3, roles: ['manager'] },
    { key: 'techC', site: s3, roles: ['technician'] },
    { key: 'assessorC', site: s3, roles: ['assessor'], covers: [s1] },
  ];
  for (const e of extras) {
    const [{ id }] = await q(`insert into users (email, name, site_id, password_hash, active, created_at, updated_at) values ($1, $2, $3, $4, true, now(), now()) returning id`, [`${e.key.toLowerCase()}@example.test`, e.key, e.site, hash]);
    for (const r of e.roles) await q('insert into user_roles (user_id, role) values ($1, $2)', [id, r]);
    for (const c of e.covers ?? []) await q('insert into user_sites (user_id, site_id) values ($1, $2)', [id, c]);
  }
  const demo: Record<string, string> = { admin: DEMO.admin, auditor: DEMO.auditor, managerA: DEMO.manager, managerB: DEMO.manager2, assessor: DEMO.assessor, tech1: DEMO.technician, tech3: DEMO.technician3 };
  const emails = { ...demo, ...Object.fromEntries(extras.map((e) => [e.key, `${e.key.toLowerCase()}@example.test`])) };
  const people: WorldPerson[] = [];
  for (const [key, email] of Object.entries(emails)) {
    const [u] = await q('select id, site_id from users where email = $1', [email]);
    const roles = (await q('select role from user_roles where user_id = $1', [u.id])).map((r) => r.role as Role).sort();
    const covered = (await q('select site_id from user_sites where user_id = $1', [u.id])).map((r) => r.site_id as string);
    people.push({ key, id: u.id, email, roles, siteId: u.site_id, siteIds: [...new Set([u.site_id, ...covered])] });
  }

  /** The person's row, roles, covered sites and stored sessions, and the audit trail's length. */
  async function snapshot(id: string) {
    const [row] = await q('select * from users where id = $1', [id]);
    const roles = (await q('select role from user_roles where user_id = $1', [id])).map((r) => r.role as string).sort();
    const covered = (await q('select site_id from user_sites where user_id = $1', [id])).map((r) => r.site_id as string).sort();
    const [{ n }] = await q('select count(*)::int as n from audit_log');
    const [{ sessions }] = await q(`select count(*)::int as sessions from "session" where sess->>'userId' = $1`, [id]);
    return { row, roles, covered, audit: n as number, sessions: sessions as number };
  }

  /** Puts an allowed change back, so every run starts from the same world. */
  async function restore(id: string, s: Awaited<ReturnType<typeof snapshot>>) {
    await q('update users set name = $2, site_id = $3, active = $4, access_ends_on = $5, deactivated_reason = $6, updated_at = $7 where id = $1',
      [id, s.row.name, s.row.site_id, s.row.active, s.row.access_ends_on, s.row.deactivated_reason, s.row.updated_at]);
    await q('delete from user_roles where user_id = $1', [id]);
    for (const r of s.roles) await q('insert into user_roles (user_id, role) values ($1, $2)', [id, r]);
    await q('delete from user_sites where user_id = $1', [id]);
    for (const c of s.covered) await q('insert into user_sites (user_id, site_id) values ($1, $2)', [id, c]);
  }

  const person = (key: string) => people.find((p) => p.key === key)!;
  return { people, person, siteIds: [s1, s2, s3] as string[], snapshot, restore };
}
