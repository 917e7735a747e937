import { and, asc, count, desc, eq, ilike, inArray, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { sites, userRoles, users, userSites } from '../db/schema/index.js';
import type { Role } from '../../shared/roles.js';

export type UserRow = typeof users.$inferSelect;

export async function findUserByEmail(db: Executor, email: string) {
  const [row] = await db.select().from(users).where(eq(users.email, email));
  return row;
}

export async function findUserById(db: Executor, id: string, lock = false) {
  const q = db.select().from(users).where(eq(users.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function rolesOf(db: Executor, userId: string): Promise<Role[]> {
  const rows = await db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, userId));
  return rows.map((r) => r.role as Role).sort();
}

export async function coveredSitesOf(db: Executor, userId: string): Promise<string[]> {
  const rows = await db.select({ siteId: userSites.siteId }).from(userSites).where(eq(userSites.userId, userId));
  return rows.map((r) => r.siteId).sort();
}

/**
 * Locks and lists the admins who keep the system administrable (active, no access end), in id order so two
 * changes to admins queue behind each other: each then sees what the other left.
 */
export async function lockStandingAdmins(db: Executor): Promise<string[]> {
  const admins = db.select({ id: userRoles.userId }).from(userRoles).where(eq(userRoles.role, 'admin'));
  const rows = await db.select({ id: users.id }).from(users)
    .where(and(eq(users.active, true), isNull(users.accessEndsOn), inArray(users.id, admins)))
    .orderBy(asc(users.id)).for('update');
  return rows.map((r) => r.id);
}

export async function insertUser(db: Executor, row: typeof users.$inferInsert) {
  const [created] = await db.insert(users).values(row).returning();
  return created;
}

export async function updateUser(db: Executor, id: string, patch: Partial<typeof users.$inferInsert>) {
  const [updated] = await db.update(users).set(patch).where(eq(users.id, id)).returning();
  return updated;
}

export async function replaceRoles(db: Executor, userId: string, roles: Role[]) {
  await db.delete(userRoles).where(eq(userRoles.userId, userId));
  if (roles.length) await db.insert(userRoles).values(roles.map((role) => ({ userId, role })));
}

export async function replaceCoveredSites(db: Executor, userId: string, siteIds: string[]) {
  await db.delete(userSites).where(eq(userSites.userId, userId));
  if (siteIds.length) await db.insert(userSites).values(siteIds.map((siteId) => ({ userId, siteId })));
}

export interface PeopleFilter {
  access: SQL;
  q?: string;
  siteId?: string;
  role?: Role;
  active?: boolean;
  sort: 'name' | 'email' | 'site' | 'createdAt';
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

const rolesAgg = sql<Role[]>`coalesce((select array_agg(r.role order by r.role) from ${userRoles} r where r.user_id = ${users.id}), '{}')`;
const sitesAgg = sql<string[]>`coalesce((select array_agg(s.site_id order by s.site_id) from ${userSites} s where s.user_id = ${users.id}), '{}')`;

/** The page in two short queries (its ids in order, then their rows with roles and covered sites) and one for the count. */
export async function listPeople(db: Executor, f: PeopleFilter) {
  const conds: SQL[] = [f.access];
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    conds.push(or(ilike(users.name, like), ilike(users.email, like)) as SQL);
  }
  if (f.siteId) conds.push(eq(users.siteId, f.siteId));
  if (f.active !== undefined) conds.push(eq(users.active, f.active));
  if (f.role) conds.push(inArray(users.id, db.select({ id: userRoles.userId }).from(userRoles).where(eq(userRoles.role, f.role))));
  const where = and(...conds);
  const sortCol = { name: users.name, email: users.email, site: sites.name, createdAt: users.createdAt }[f.sort];
  const order = f.dir === 'asc' ? asc(sortCol) : desc(sortCol);
  // The page's ids first (only the sort needs the join); the per-person aggregates then run for 25 rows,
  // not for every row the offset skips.
  const pageIds = (await db.select({ id: users.id }).from(users).innerJoin(sites, eq(sites.id, users.siteId))
    .where(where).orderBy(order, asc(users.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize)).map((r) => r.id);
  const rows = pageIds.length
    ? await db
      .select({
        id: users.id, email: users.email, name: users.name, siteId: users.siteId, siteName: sites.name,
        active: users.active, accessEndsOn: users.accessEndsOn, createdAt: users.createdAt,
        hasPassword: sql<boolean>`${users.passwordHash} is not null`, roles: rolesAgg, coveredSiteIds: sitesAgg,
      })
      .from(users)
      .innerJoin(sites, eq(sites.id, users.siteId))
      .where(inArray(users.id, pageIds))
    : [];
  const byId = new Map(rows.map((r) => [r.id, r]));
  const items = pageIds.map((id) => byId.get(id)!);
  const [{ total }] = await db.select({ total: count() }).from(users).innerJoin(sites, eq(sites.id, users.siteId)).where(where);
  return { items, total };
}
