import type { Deps } from '../deps.js';
import type { Executor } from '../db/client.js';
import type { Actor } from '../../shared/abilities.js';
import * as rem from './reminders.repository.js';

type Reminder = Awaited<ReturnType<typeof rem.claimUnqueued>>[number];

/**
 * Review-due reminders to managers. Each (version, manager, offset) is recorded once, and its message is
 * recorded in the mail outbox in the same transaction, so it goes out once however often or wherever the
 * sweep runs; the outbox retries a failed send. Of the offsets a review has already passed, only the
 * nearest is due (a late first run sends one message).
 */
export function makeReviewReminders(deps: Deps) {
  const { db, clock, mailer, config, audit } = deps;
  mailer.onOutcome('review:', rem.recordDelivery);

  async function compose(tx: Executor, r: Reminder) {
    const c = await rem.reminderContext(tx, r.versionId, r.managerId);
    if (!c) return null;
    const when = r.offsetDays === 0 ? `was due on ${r.reviewDueOn}` : `falls due on ${r.reviewDueOn}`;
    const text = `Hello ${c.name},\n\nThe periodic review of ${c.code} "${c.title}" (version ${c.number}, in force) ${when}.\n\nCheck it against current practice, the equipment on the benches and any incidents since it was approved. If nothing needs changing, record that by publishing an editorial version with a review note; otherwise start a new draft.\n\n${config.publicUrl}/procedures/${c.procedureId}\n`;
    return { key: `review:${r.id}`, to: c.email, subject: `Review ${r.offsetDays === 0 ? 'overdue' : 'due'}: ${c.code} by ${r.reviewDueOn}`, text, kind: 'procedure-review' };
  }

  async function run(actor: Actor | null, offsets: number[]) {
    const now = clock.now();
    const sorted = [...new Set(offsets)].sort((a, b) => a - b);
    const due = await rem.reviewsDueWithin(db, now, sorted[sorted.length - 1]);
    const rows = due.flatMap((d) => {
      const offset = sorted.find((o) => d.daysLeft <= o);
      return offset === undefined ? [] : [{ versionId: d.versionId, managerId: d.managerId, offsetDays: offset, reviewDueOn: d.reviewDueOn, createdAt: now }];
    });
    const queued = await db.transaction(async (tx) => {
      const added = await rem.recordReminders(tx, rows);
      // The scheduled run is in the trail only when it recorded something; a run a person asked for always is.
      if (added || actor) {
        await audit(tx, { actorId: actor?.id ?? null, action: 'procedure.review_sweep', entity: 'procedure_review_reminders', entityId: 'sweep', newValues: { offsets: sorted, candidates: rows.length, recorded: added } });
      }
      const mails = [];
      for (const r of await rem.claimUnqueued(tx, now)) {
        const mail = await compose(tx, r);
        if (mail) mails.push(mail);
      }
      await mailer.enqueueAll(tx, mails);
      return mails.length;
    });
    await mailer.wake();
    return { candidates: rows.length, queued };
  }

  return { run };
}
