import { randomUUID } from 'node:crypto';
import type { Database, Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import { createTransport, type MailConfig, type MailTransport } from './transport.js';
import { makeDelivery, type DeliveryResult, type OutcomeHandler } from './delivery.js';
import { insertMessages, nextWaitingAt, withdraw } from './outbox.repository.js';

export type { MailConfig, MailTransport } from './transport.js';
export type { Delivered, DeliveryResult, OutcomeHandler } from './delivery.js';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  kind: string;
}

/** How this process asks the job queue for a delivery run: now, or after some seconds. */
export type DeliveryRequest = (afterSeconds?: number) => Promise<unknown>;

export interface Mailer {
  /**
   * Records a message in the caller's transaction: it exists exactly when the change that causes it
   * commits, once per key. Returns the new row's id, or null when the key was recorded before.
   */
  enqueue(tx: Executor, mail: OutgoingMail, opts: { key: string }): Promise<string | null>;
  /** The same for many messages in one write; returns the new rows' ids by key. */
  enqueueAll(tx: Executor, mails: (OutgoingMail & { key: string })[]): Promise<Map<string, string>>;
  /** After a transaction that enqueued mail has committed: asks the queue for a delivery run (never throws). */
  wake(): Promise<void>;
  /** Delivers everything due now, in this process; then asks the queue to come back for what waits. */
  deliver(): Promise<DeliveryResult>;
  /** Withdraws messages not yet being sent, in the caller's transaction. */
  withdraw(tx: Executor, ids: string[]): Promise<number>;
  /** A sender's handler, told in the same transaction when its messages (keys starting with `prefix`) are sent or fail. */
  onOutcome(prefix: string, handler: OutcomeHandler): void;
  /** The job queue's delivery request, set by the process that runs the queue (null: none here). */
  useQueue(request: DeliveryRequest | null): void;
}

/** The one path of every e-mail: a row in the outbox (mail_log), delivered afterwards by the queue. */
export function createMailer(db: Database, clock: Clock, cfg: MailConfig, transport: MailTransport = createTransport(cfg)): Mailer {
  const handlers = new Map<string, OutcomeHandler>();
  const delivery = makeDelivery(db, clock, transport, handlers);
  let request: DeliveryRequest | null = null;

  const row = (m: OutgoingMail & { key: string }) => {
    const id = randomUUID();
    const now = clock.now();
    return {
      id, dedupeKey: m.key, toAddress: m.to, subject: m.subject, body: m.text, kind: m.kind, status: 'waiting',
      attempts: 0, nextAttemptAt: now, createdAt: now, messageId: `<${id}@breakover.invalid>`,
    };
  };

  async function ask(afterSeconds?: number) {
    if (!request) return;
    await request(afterSeconds).catch((err: Error) => console.error(`[mail] could not ask the queue for delivery: ${err.message}`));
  }

  return {
    async enqueue(tx, mail, { key }) {
      return (await insertMessages(tx, [row({ ...mail, key })])).get(key) ?? null;
    },
    enqueueAll: (tx, mails) => insertMessages(tx, mails.map(row)),
    wake: () => ask(),
    async deliver() {
      const result = await delivery.deliver();
      const next = await nextWaitingAt(db);
      if (next) await ask(Math.max(1, Math.ceil((next.getTime() - clock.now().getTime()) / 1000)));
      return result;
    },
    withdraw,
    onOutcome(prefix, handler) {
      handlers.set(prefix, handler);
    },
    useQueue(r) {
      request = r;
    },
  };
}
