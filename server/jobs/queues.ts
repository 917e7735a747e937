import type PgBoss from 'pg-boss';

/** Every queue, created once by the migrations in this order (pg-boss 10 needs a queue before the first send). */
export const QUEUES = {
  sweep: 'reminders-sweep',
  deliver: 'reminders-deliver',
  mail: 'mail-deliver',
  seal: 'audit-seal',
  import: 'authorisations-import',
} as const;

export const QUEUE_OPTIONS: { name: string; options: PgBoss.Queue }[] = [
  // A sweep that throws (the database went away, say) is retried with growing delays.
  { name: QUEUES.sweep, options: { name: QUEUES.sweep, policy: 'standard', retryLimit: 10, retryDelay: 30, retryBackoff: true, expireInSeconds: 15 * 60 } },
  // Re-delivery of failed sends: one waiting at a time is enough.
  { name: QUEUES.deliver, options: { name: QUEUES.deliver, policy: 'short', retryLimit: 10, retryDelay: 30, retryBackoff: true, expireInSeconds: 15 * 60 } },
  // Delivery of the mail outbox, asked for after a commit that wrote mail ('now') and for the next back-off ('later').
  { name: QUEUES.mail, options: { name: QUEUES.mail, policy: 'short', retryLimit: 10, retryDelay: 30, retryBackoff: true, expireInSeconds: 15 * 60 } },
  // Sealing the audit trail after appends: one run waiting and one running is enough (the sealer takes turns by lock).
  { name: QUEUES.seal, options: { name: QUEUES.seal, policy: 'stately', retryLimit: 10, retryDelay: 10, retryBackoff: true, expireInSeconds: 15 * 60 } },
  // A large CSV import: run once (a failure is recorded on the import's own row, and the manager starts again).
  { name: QUEUES.import, options: { name: QUEUES.import, policy: 'standard', retryLimit: 0, expireInSeconds: 60 * 60 } },
];

/** Every ten minutes: often enough that a lapse notice follows the lapse closely. */
export const SWEEP_CRON = '*/10 * * * *';
