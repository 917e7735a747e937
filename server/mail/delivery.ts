import type { Database, Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import type { MailTransport } from './transport.js';
import * as outbox from './outbox.repository.js';

const MINUTE = 60_000;
/** Messages per claim, claims at once in one process, messages handed to the transport at once by each. */
const BATCH = 50;
const WORKERS = 3;
const IN_FLIGHT = 8;
/** A message left 'sending' this long (its sender stopped) is sent again, with the same Message-ID. */
export const STALE_SENDING_MS = 10 * MINUTE;
/** After this many attempts a message stops being retried by itself; an admin can retry it. */
export const MAX_ATTEMPTS = 12;
/** 1, 2, 4 … minutes between attempts, at most 6 hours. */
export const backoffMs = (attempts: number) => Math.min(6 * 60 * MINUTE, MINUTE * 2 ** Math.max(0, attempts - 1));

/** What a sender of mail is told about its messages, in the transaction that records the outcome. */
export interface Delivered {
  id: string;
  key: string;
  status: 'sent' | 'waiting' | 'failed';
  attempts: number;
  error: string | null;
  nextAttemptAt: Date;
  at: Date;
}
export type OutcomeHandler = (tx: Executor, outcomes: Delivered[]) => Promise<void>;

export interface DeliveryResult {
  sent: number;
  retrying: number;
  failed: number;
}

/** A refusal the mail server calls permanent (5xx) is not retried by itself. */
const permanent = (err: Error & { responseCode?: number }) => (err.responseCode ?? 0) >= 500;

/**
 * Delivery: claim in a short statement, transmit with no transaction open, then record each outcome (and
 * tell the sender's handler) in a short transaction. Several processes may run it at once.
 */
export function makeDelivery(db: Database, clock: Clock, transport: MailTransport, handlers: Map<string, OutcomeHandler>) {
  async function transmit(row: outbox.OutboxRow): Promise<outbox.Outcome> {
    try {
      const { fileName } = await transport.send({ id: row.id, messageId: row.messageId!, to: row.toAddress, subject: row.subject, text: row.body!, createdAt: row.createdAt });
      return { status: 'sent', fileName };
    } catch (err) {
      const e = err as Error;
      const giveUp = permanent(e) || row.attempts >= MAX_ATTEMPTS;
      return { status: giveUp ? 'failed' : 'waiting', error: e.message || String(err), nextAttemptAt: new Date(clock.now().getTime() + backoffMs(row.attempts)) };
    }
  }

  async function record(results: { row: outbox.OutboxRow; outcome: outbox.Outcome }[], out: DeliveryResult) {
    if (!results.length) return;
    await db.transaction(async (tx) => {
      const now = clock.now();
      const recorded = await outbox.recordOutcomes(tx, results, now);
      const told: Delivered[] = [];
      for (const { row, outcome } of results) {
        if (!recorded.has(row.id)) continue;
        out[outcome.status === 'sent' ? 'sent' : outcome.status === 'failed' ? 'failed' : 'retrying']++;
        told.push({
          id: row.id, key: row.dedupeKey, status: outcome.status, attempts: row.attempts, at: now,
          error: outcome.status === 'sent' ? null : outcome.error, nextAttemptAt: outcome.status === 'sent' ? row.nextAttemptAt : outcome.nextAttemptAt,
        });
      }
      for (const [prefix, handler] of handlers) {
        const mine = told.filter((d) => d.key.startsWith(prefix));
        if (mine.length) await handler(tx, mine);
      }
    });
  }

  async function loop(out: DeliveryResult) {
    for (;;) {
      const now = clock.now();
      const claimed = await outbox.claimDue(db, now, new Date(now.getTime() - STALE_SENDING_MS), BATCH);
      const outcomes: outbox.Outcome[] = [];
      // A few at a time to the transport, with no transaction open; then the batch's outcomes in one write.
      for (let i = 0; i < claimed.length; i += IN_FLIGHT) outcomes.push(...(await Promise.all(claimed.slice(i, i + IN_FLIGHT).map(transmit))));
      await record(claimed.map((row, j) => ({ row, outcome: outcomes[j] })), out);
      if (claimed.length < BATCH) return;
    }
  }

  /** Delivers everything due now; a message that fails waits for its next attempt. */
  async function deliver(): Promise<DeliveryResult> {
    const out: DeliveryResult = { sent: 0, retrying: 0, failed: 0 };
    await Promise.all(Array.from({ length: WORKERS }, () => loop(out)));
    return out;
  }

  return { deliver };
}
