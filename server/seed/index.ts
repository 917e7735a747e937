import { count } from 'drizzle-orm';
import type { Database } from '../db/client.js';
import type { Clock } from '../clock.js';
import { users } from '../db/schema/index.js';
import { makeAudit } from '../audit/audit.service.js';
import { seedPeople } from './seed-people.js';
import { seedBenches } from './seed-benches.js';
import { seedAuthorisations } from './seed-authorisations.js';
import { seedProcedures } from './seed-procedures.js';
import { seedRecords } from './seed-records.js';

/**
 * Seeds the demo scenario into an empty database, in one transaction. Later features add their own
 * seed steps to SEED_STEPS; each receives the people and sites created before it.
 */
export async function seedDemoIfEmpty(db: Database, clock: Clock): Promise<boolean> {
  const [{ n }] = await db.select({ n: count() }).from(users);
  if (n > 0) return false;
  const audit = makeAudit(clock);
  await db.transaction(async (tx) => {
    const ctx = await seedPeople(tx, clock, audit);
    for (const step of SEED_STEPS) await step(tx, clock, audit, ctx);
  });
  return true;
}

export type SeedContext = Awaited<ReturnType<typeof seedPeople>>;
export type SeedStep = (tx: Parameters<Parameters<Database['transaction']>[0]>[0], clock: Clock, audit: ReturnType<typeof makeAudit>, ctx: SeedContext) => Promise<void>;

// Sign-offs and practicals come before the authorisations, which rest on them.
const SEED_STEPS: SeedStep[] = [seedBenches, seedProcedures, seedRecords, seedAuthorisations];
