import { and, asc, eq, getTableColumns, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { authorisationPeriods, practicals } from '../db/schema/index.js';
import type { PeriodRow } from '../authorisations/periods.repository.js';

const { during: _during, ...periodColumns } = getTableColumns(authorisationPeriods);

/** Every period of every authorisation one person holds, oldest first: their history in one query. */
export async function periodsOfHolder(db: Executor, holderId: string): Promise<PeriodRow[]> {
  return db.select(periodColumns).from(authorisationPeriods).where(eq(authorisationPeriods.holderId, holderId)).orderBy(asc(authorisationPeriods.startsAt));
}

/** Narrows the practicals list (server/practicals) to the ones a person was assessed in. */
export const practicalsOf = (access: SQL, personId: string): SQL => and(access, eq(practicals.technicianId, personId)) as SQL;
