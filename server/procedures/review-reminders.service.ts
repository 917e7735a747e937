import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import * as rem from './reminders.repository.js';

const STALE_CLAIM_MS = 10 * 60_000;

/**
 * Review-due reminders to managers. Each (version, manager, offset) is recorded before it is sent, so it
 * goes out once however often or wherever the sweep runs; one that failed to send is retried next run.
 * Of the offsets a review has already passed, only the nearest is due (a late first run sends one message).
 */
export function makeReviewReminders(deps: Deps) {
  const { db, clock, mailer, config, audit } = deps;

  async function run(actor: Actor | null, offsets: number[]) {
    const now = clock.now();
    const sorted = [...new Set(offsets)].sort((a, b) => a - b);
    const due = await rem.reviewsDueWithin(db, now, sorted[sorted.length - 1]);
    const rows = due.flatMap((d) => {
      const offset = sorted.find((o) => d.daysLeft <= o);
      return offset === undefined ? [] : [{ versionId: d.versionId, managerId: d.managerId, offsetDays: offset, reviewDueOn: d.reviewDueOn, createdAt: now }];
    });
    await db.transaction(async (tx) => {
      const added = await rem.recordReminders(tx, rows);
      // The scheduled run is in the trail only when it recorded something; a run a person asked for always is.
      if (added || actor) {
        await audit(tx, { actorId: actor?.id ?? null, action: 'procedure.review_sweep', entity: 'procedure_review_reminders', entityId: 'sweep', newValues: { offsets: sorted, candidates: rows.length, recorded: added } });
      }
    });
    const claimed = await rem.claimUnsent(db, now, new Date(now.getTime() - STALE_CLAIM_MS));
    let sent = 0;
    let failed = 0;
    for (const r of claimed) {
      const c = await rem.reminderContext(db, r.versionId, r.managerId);
      if (!c) continue;
      const when = r.offsetDays === 0 ? `was due on ${r.reviewDueOn}` : `falls due on ${r.reviewDueOn}`;
      const text = `Hello ${c.name},\n\nThe periodic review of ${c.code} "${c.title}" (version ${c.number}, in force) ${when}.\n\nCheck it against current practice, the equipment on the benches and any incidents since it was approved. If nothing needs changing, record that by publishing an editorial version with a review note; otherwise start a new draft.\n\n${config.publicUrl}/procedures/${c.procedureId}\n`;
      try {
        await mailer.send({ to: c.email, subject: `Review ${r.offsetDays === 0 ? 'overdue' : 'due'}: ${c.code} by ${r.reviewDueOn}`, text, kind: 'procedure-review' });
        await rem.markSent(db, r.id, clock.now());
        sent++;
      } catch (err) {
        await rem.markFailed(db, r.id, (err as Error).message);
        failed++;
      }
    }
    return { candidates: rows.length, sent, failed };
  }

  return { run };
}
