import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { procedureAcknowledgements, procedureRereadRequests, procedures, procedureVersions, sites, users } from '../db/schema/index.js';

export interface PersonRow {
  id: string;
  name: string;
  email: string;
  active: boolean;
  siteId: string;
  siteName: string;
  timeZone: string;
}

const personColumns = { id: users.id, name: users.name, email: users.email, active: users.active, siteId: users.siteId, siteName: sites.name, timeZone: sites.timeZone };

/**
 * Every change to a person's evidence takes this row lock before deciding, so two of them never decide at
 * once. SELECT … FOR NO KEY UPDATE rather than plain FOR UPDATE: inserting evidence that references the
 * person takes a key-share lock on the row, and two such transactions each asking FOR UPDATE would deadlock.
 */
export async function lockPerson(db: Executor, id: string): Promise<PersonRow | undefined> {
  const [row] = await db.select(personColumns).from(users).innerJoin(sites, eq(sites.id, users.siteId)).where(eq(users.id, id)).for('no key update', { of: users });
  return row;
}

export async function findPerson(db: Executor, id: string): Promise<PersonRow | undefined> {
  const [row] = await db.select(personColumns).from(users).innerJoin(sites, eq(sites.id, users.siteId)).where(eq(users.id, id));
  return row;
}

export async function findPeople(db: Executor, ids: string[]): Promise<PersonRow[]> {
  return ids.length ? db.select(personColumns).from(users).innerJoin(sites, eq(sites.id, users.siteId)).where(inArray(users.id, ids)) : [];
}

export interface AckFact {
  procedureId: string;
  code: string;
  inForce: { versionId: string; number: number; ackFromNumber: number; title: string } | null;
  latest: { id: string; number: number; at: Date } | null;
  request: { dueOn: string; changeClass: string } | null;
}

/**
 * For each person and procedure: the version in force, the person's newest acknowledgement, and any
 * re-read asked of them. Three queries whatever the number of people.
 */
export async function ackFacts(db: Executor, userIds: string[], procedureIds: string[]): Promise<Map<string, Map<string, AckFact>>> {
  const byUser = new Map(userIds.map((u) => [u, new Map<string, AckFact>()]));
  if (!procedureIds.length || !userIds.length) return byUser;
  const inForce = await db
    .select({ procedureId: procedures.id, code: procedures.code, versionId: procedureVersions.id, number: procedureVersions.number, ackFrom: procedureVersions.ackFromNumber, title: procedureVersions.title })
    .from(procedures)
    .leftJoin(procedureVersions, and(eq(procedureVersions.procedureId, procedures.id), eq(procedureVersions.status, 'published')))
    .where(inArray(procedures.id, procedureIds));
  const acks = await db
    .selectDistinctOn([procedureAcknowledgements.userId, procedureAcknowledgements.procedureId], { userId: procedureAcknowledgements.userId, procedureId: procedureAcknowledgements.procedureId, id: procedureAcknowledgements.id, number: procedureAcknowledgements.versionNumber, at: procedureAcknowledgements.acknowledgedAt })
    .from(procedureAcknowledgements)
    .where(and(inArray(procedureAcknowledgements.userId, userIds), inArray(procedureAcknowledgements.procedureId, procedureIds)))
    .orderBy(procedureAcknowledgements.userId, procedureAcknowledgements.procedureId, desc(procedureAcknowledgements.versionNumber));
  const versionIds = inForce.map((v) => v.versionId).filter((v): v is string => !!v);
  const requests = versionIds.length
    ? await db.select({ userId: procedureRereadRequests.userId, versionId: procedureRereadRequests.versionId, dueOn: procedureRereadRequests.dueOn, changeClass: procedureRereadRequests.changeClass })
      .from(procedureRereadRequests).where(and(inArray(procedureRereadRequests.userId, userIds), inArray(procedureRereadRequests.versionId, versionIds)))
    : [];
  for (const [userId, out] of byUser) {
    for (const v of inForce) {
      const ack = acks.find((a) => a.userId === userId && a.procedureId === v.procedureId);
      const req = requests.find((r) => r.userId === userId && r.versionId === v.versionId);
      out.set(v.procedureId, {
        procedureId: v.procedureId, code: v.code,
        inForce: v.versionId ? { versionId: v.versionId, number: v.number!, ackFromNumber: v.ackFrom ?? v.number!, title: v.title! } : null,
        latest: ack ? { id: ack.id, number: ack.number, at: ack.at } : null,
        request: req ? { dueOn: req.dueOn, changeClass: req.changeClass } : null,
      });
    }
  }
  return byUser;
}

/** Managers of a site (its own and those covering it), active: who hears about its people's authorisations. */
export async function siteManagers(db: Executor, siteId: string) {
  const rows = await db.execute(sql`
    select u.id, u.name, u.email from users u
    where u.active and exists (select 1 from user_roles r where r.user_id = u.id and r.role = 'manager')
      and (u.site_id = ${siteId} or exists (select 1 from user_sites us where us.user_id = u.id and us.site_id = ${siteId}))
    order by u.name, u.id`);
  return (rows as unknown as { rows: { id: string; name: string; email: string }[] }).rows;
}
