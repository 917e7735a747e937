import type { Deps } from '../deps.js';
import type { OutgoingMail } from '../mail/mailer.js';
import type { Actor } from '../../shared/abilities.js';
import { reevaluatePerson } from '../authorisations/issuing.js';
import * as repo from './reminders.repository.js';
import * as candidates from './candidates.repository.js';
import * as planning from './planning.repository.js';
import { mailComposer } from './context.js';

const MINUTE = 60_000;
/** Sends per delivery transaction, and delivery transactions at once in one process. */
const BATCH = 100;
const WORKERS = 3;
/** 1, 2, 4 … minutes between attempts, at most 6 hours: a failing transport is retried until it works. */
export const backoffMs = (attempts: number) => Math.min(6 * 60 * MINUTE, MINUTE * 2 ** Math.max(0, attempts - 1));

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
      console.error(`[sweep] could not re-decide person ${personId}: ${(e.cause ?? e).message.split('\n')[0]}`);
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
      await repo.cancelMoved(tx);
      const n = await planning.planSends(tx, clock.now());
      if (n) await audit(tx, { actorId: null, action: 'reminders.planned', entity: 'reminder_sends', entityId: clock.now().toISOString(), newValues: { count: n } });
      return n;
    });
  }

  /**
   * Delivers every due send, a batch per transaction: each batch claims its rows (other workers skip them),
   * composes from what stands now, and marks a send sent only once the transport has taken its message.
   */
  async function deliver() {
    const out = { sent: 0, failed: 0, cancelled: 0 };
    // A few batches at once, as several processes would: SKIP LOCKED keeps them on different sends.
    await Promise.all(Array.from({ length: WORKERS }, () => deliverBatches(out)));
    return out;
  }

  async function deliverBatches(out: { sent: number; failed: number; cancelled: number }) {
    for (;;) {
      const claimed = await db.transaction(async (tx) => {
        const now = clock.now();
        const batch = await repo.claimDue(tx, now, BATCH);
        const people = await repo.recipientsOf(tx, batch.map((s) => s.recipientId));
        const composer = mailComposer(tx, config, now);
        await composer.prefetch(batch);
        const sent: { id: string; mail_id: string }[] = [];
        const cancelled: string[] = [];
        const outgoing: { send: (typeof batch)[number]; mail: OutgoingMail }[] = [];
        for (const s of batch) {
          const to = people.get(s.recipientId);
          const mail = to?.active ? await composer.compose(s, to.name) : null;
          if (to && mail) outgoing.push({ send: s, mail: { to: to.email, ...mail } });
          else cancelled.push(s.id);
        }
        const results = await mailer.sendAll(outgoing.map((o) => o.mail), { log: tx });
        for (const [i, r] of results.entries()) {
          const s = outgoing[i].send;
          if (r.ok) sent.push({ id: s.id, mail_id: r.id });
          else {
            // Still pending: it is marked sent only after the transport has taken it.
            await repo.markFailed(tx, s.id, s.attempts + 1, new Date(now.getTime() + backoffMs(s.attempts + 1)), r.error);
            out.failed++;
          }
        }
        await repo.markSent(tx, sent, clock.now());
        await repo.cancelSends(tx, cancelled);
        out.sent += sent.length;
        out.cancelled += cancelled.length;
        return batch.length;
      });
      // A short batch means nothing more is due now (failed sends wait for their next attempt).
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
