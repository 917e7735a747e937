import type { Deps } from '../deps.js';
import { adminAddresses } from './anchor.repository.js';

/**
 * The one place the anchor is mailed: once per admin and day (the outbox key says so), so copies of the
 * head sit in mailboxes the database cannot reach.
 */
export async function mailAnchor(deps: Deps, a: { at: string; id: number; hmac: string }): Promise<void> {
  const day = deps.clock.now().toISOString().slice(0, 10);
  const text = [
    `The audit trail's sealed head, recorded ${a.at}:`,
    '',
    `  entry #${a.id}`,
    `  seal ${a.hmac}`,
    '',
    'Keep this message. "Verify the chain" on the Audit trail page checks the trail against these anchors;',
    'if the trail is ever cut back or rebuilt, the entry and seal above show where it stood.',
  ].join('\n');
  const sent = await deps.db.transaction(async (tx) => {
    const admins = await adminAddresses(tx);
    const mails = admins.map((p) => ({ to: p.email, subject: `Audit trail anchor for ${day}`, text, kind: 'audit.anchor', key: `audit-anchor:${day}:${p.id}` }));
    return (await deps.mailer.enqueueAll(tx, mails)).size;
  });
  if (sent) await deps.mailer.wake();
}
