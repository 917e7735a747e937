import { desc, eq } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { benchTypeAcDecisions, users } from '../db/schema/index.js';
import type { TypeAcDecisionView } from '../../shared/schemas/bench-decisions.js';

const columns = {
  id: benchTypeAcDecisions.id, benchId: benchTypeAcDecisions.benchId, decidedById: benchTypeAcDecisions.decidedBy,
  decidedByName: users.name, decidedAt: benchTypeAcDecisions.decidedAt, reason: benchTypeAcDecisions.reason,
};
type Row = { id: string; benchId: string; decidedById: string; decidedByName: string; decidedAt: Date; reason: string };
const present = (r: Row): TypeAcDecisionView => ({ ...r, decidedAt: r.decidedAt.toISOString() });

function select(db: Executor) {
  return db.select(columns).from(benchTypeAcDecisions).innerJoin(users, eq(users.id, benchTypeAcDecisions.decidedBy));
}

export async function insertTypeAcDecision(db: Executor, row: typeof benchTypeAcDecisions.$inferInsert) {
  const [created] = await db.insert(benchTypeAcDecisions).values(row).returning({ id: benchTypeAcDecisions.id });
  return created;
}

/** Every decision for a bench, newest first: the first one stands. */
export async function typeAcDecisionsOf(db: Executor, benchId: string) {
  const rows = await select(db).where(eq(benchTypeAcDecisions.benchId, benchId)).orderBy(desc(benchTypeAcDecisions.decidedAt), desc(benchTypeAcDecisions.id));
  return rows.map(present);
}

export async function typeAcDecision(db: Executor, id: string) {
  const [row] = await select(db).where(eq(benchTypeAcDecisions.id, id));
  return row ? present(row) : null;
}
