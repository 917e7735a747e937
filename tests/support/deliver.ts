import type { Mailer } from '../../server/mail/mailer.js';

/**
 * Stands in for the job queue in a test process: a delivery asked for after commit runs at once, in
 * process, before the request that caused it answers. A later run (a back-off) is left to the test.
 */
export function deliverOnCommit(mailer: Mailer) {
  mailer.useQueue(async (afterSeconds) => {
    if (afterSeconds === undefined) await mailer.deliver();
  });
}

/** Runs delivery to completion in this app, as the queue's worker would. */
export async function deliverMail(t: { deps: { mailer: Mailer } }) {
  return t.deps.mailer.deliver();
}
