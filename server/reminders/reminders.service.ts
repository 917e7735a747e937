import type { Deps } from '../deps.js';
import type { OutgoingMail } from '../mail/mailer.js';
import type { Actor } from '../../shared/abilities.js';
import { reevaluatePerson } from '../authorisations/issuing.js';
import * as repo from './reminders.repository.js';
import * as candidates from './candidates.repository.js';
import * as planning from './planning.repository.js';
import { mailComposer } from './context.js';

/** Sends handed to the outbox per transaction, and such transactions at once in one process. */
const BATCH = 100;
const WORKERS = 3;

export interface SweepResult {
  reevaluated: number;
  planned: number;
  sent: number;
  failed: number;
  cancelled: number;
  /** When the next failed send is due again, if any. */
  nextAttemptAt: string | null;
}

/**
 * The sweep: record what lapsed or must be suspended by now, record the reminders and notices that are
 * due, then deliver every due send. Safe to run in several processes at once.
 */
export function makeReminders(deps: Deps) {
  const { db, clock, mailer, config, audit } = deps;
  mailer.onOutcome('reminder:', repo.recordDelivery);

  async function recordDue(): Promise<number> {
    const now = clock.now();
    const people = new Set([
      ...(await candidates.lapseCandidates(db, now, 2000)),
      ...(await candidates.graceCandidates(db, now, 2000)),
      ...(await candidates.rereadCandidates(db, now, 2000)),
      ...(await candidates.acknowledgementCandidates(db, now, 2000)),
    ]);
    let n = 0;
    for (const id of people) if (await redecide(id)) n++;
    return n + (await redecideChangedScopes(people));
  }

  /**
   * Re-decides one person in a transaction of their own. One person whose decision fails (say, their
   * record breaks a rule) is logged and left for the next sweep; everyone else is still decided.
   */
  async function redecide(personId: string): Promise<boolean> {
    try {
      await db.transaction((tx) => reevaluatePerson(tx, personId, { ...deps, actorId: null }));
      return true;
    } catch (err) {
      const e = err as Error & { cause?: Error };
      deps.log.error({ personId, err: e.cause ?? e }, `sweep: could not re-decide person ${personId}`);
      return false;
    }
  }

  /**
   * A new or edited scope is decided for everyone it concerns: those who already meet it are issued it,
   * and what rests on it follows the change. `done` are people already re-decided in this sweep.
   */
  async function redecideChangedScopes(done: Set<string>): Promise<number> {
    let n = 0;
    for (const scope of await candidates.changedScopes(db)) {
      let failed = false;
      for (const id of await candidates.scopeCandidates(db, scope.id, clock.now())) {
        if (done.has(id)) continue;
        if (await redecide(id)) n++;
        else failed = true;
        done.add(id);
      }
      // With a failure the scope stays marked as changed, so the next sweep tries again.
      if (!failed) await candidates.markScopeRedecided(db, scope.id, scope.seen);
    }
    return n;
  }

  async function plan(): Promise<number> {
    return db.transaction(async (tx) => {
      await mailer.withdraw(tx, await repo.cancelMoved(tx));
      const n = await planning.planSends(tx, clock.now());
      if (n) await audit(tx, { actorId: null, action: 'reminders.planned', entity: 'reminder_sends', entityId: clock.now().toISOString(), newValues: { count: n } });
      return n;
    });
  }

  /**
   * Hands every due send to the mail outbox, a batch per transaction: each batch claims its rows (other
   * workers skip them), composes from what stands now and records the messages with them; then the outbox
   * delivers. A send is marked sent only once the mail server has taken its message (recordDelivery).
   */
  async function deliver() {
    const out = { cancelled: 0 };
    // A few batches at once, as several processes would: SKIP LOCKED keeps them on different sends.
    await Promise.all(Array.from({ length: WORKERS }, () => handOverBatches(out)));
    const delivered = await mailer.deliver();
    return { sent: delivered.sent, failed: delivered.retrying + delivered.failed, cancelled: out.cancelled };
  }

  async function handOverBatches(out: { cancelled: number }) {
    for (;;) {
      const claimed = await db.transaction(async (tx) => {
        const now = clock.now();
        const batch = await repo.claimDue(tx, now, BATCH);
        const people = await repo.recipientsOf(tx, batch.map((s) => s.recipientId));
        const composer = mailComposer(tx, config, now);
        await composer.prefetch(batch);
        const cancelled: string[] = [];
        const outgoing: (OutgoingMail & { key: string; sendId: string })[] = [];
        for (const s of batch) {
          const to = people.get(s.recipientId);
          const mail = to?.active ? await composer.compose(s, to.name) : null;
          if (to && mail) outgoing.push({ key: `reminder:${s.id}`, sendId: s.id, to: to.email, ...mail });
          else cancelled.push(s.id);
        }
        const ids = await mailer.enqueueAll(tx, outgoing);
        await repo.markQueued(tx, outgoing.flatMap((o) => (ids.has(o.key) ? [{ id: o.sendId, mail_id: ids.get(o.key)! }] : [])));
        await repo.cancelSends(tx, cancelled);
        out.cancelled += cancelled.length;
        return batch.length;
      });
      // A short batch means nothing more is due now.
      if (claimed < BATCH) break;
    }
  }

  async function sweep(): Promise<SweepResult> {
    const reevaluated = await recordDue();
    const planned = await plan();
    const delivered = await deliver();
    const next = await repo.nextPendingAt(db);
    return { reevaluated, planned, ...delivered, nextAttemptAt: next?.toISOString() ?? null };
  }

  async function list(actor: Actor, q: { status?: string; page: number; pageSize: number }) {
    const all = actor.roles.includes('admin') || actor.roles.includes('auditor');
    const { items, total } = await repo.listSends(db, { ...q, siteIds: all ? null : [...actor.siteIds] });
    return {
      items: items.map(({ send: s, recipientName, recipientEmail }) => ({
        id: s.id, periodId: s.periodId, certificateId: s.certificateId, offsetDays: s.offsetDays, recipientName, recipientEmail, recipientRole: s.recipientRole,
        dueAt: s.dueAt.toISOString(), status: s.status, attempts: s.attempts, nextAttemptAt: s.nextAttemptAt.toISOString(), lastError: s.lastError,
        sentAt: s.sentAt?.toISOString() ?? null,
      })),
      total, page: q.page, pageSize: q.pageSize,
    };
  }

  return { sweep, recordDue, plan, deliver, list };
}
export type Reminders = ReturnType<typeof makeReminders>;
