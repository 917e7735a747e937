import type { Executor } from '../db/client.js';
import { eventsOf, latestPeriods } from './periods.repository.js';
import type { Standing } from './eligibility.js';

/** The latest period of one authorisation begun by `now`, with all its events. */
export async function standingOf(db: Executor, authorisationId: string, now: Date): Promise<Standing | null> {
  const [period] = await latestPeriods(db, { authorisationIds: [authorisationId] }, now);
  if (!period) return null;
  return { authorisationId, period, events: await eventsOf(db, [period.id]) };
}

/** Every running period of a person, each with its events. */
export async function runningOf(db: Executor, holderId: string, now: Date): Promise<Standing[]> {
  const periods = (await latestPeriods(db, { holderIds: [holderId] }, now)).filter((p) => p.endsAt > now);
  const events = await eventsOf(db, periods.map((p) => p.id));
  return periods.map((p) => ({ authorisationId: p.authorisationId, period: p, events: events.filter((e) => e.periodId === p.id) }));
}
