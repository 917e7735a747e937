import { and, eq, inArray, or } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { authorisationPeriods, externalCertificates, reminderSends } from '../db/schema/index.js';

/** Reminders still waiting to go to or about a person who has left. */
export async function cancelPendingFor(db: Executor, personId: string) {
  await db.update(reminderSends).set({ status: 'cancelled' }).where(and(
    eq(reminderSends.status, 'pending'),
    or(
      eq(reminderSends.recipientId, personId),
      inArray(reminderSends.periodId, db.select({ id: authorisationPeriods.id }).from(authorisationPeriods).where(eq(authorisationPeriods.holderId, personId))),
      inArray(reminderSends.certificateId, db.select({ id: externalCertificates.id }).from(externalCertificates).where(eq(externalCertificates.holderId, personId))),
    ),
  ));
}
