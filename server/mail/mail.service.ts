import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { Deps } from '../deps.js';
import type { MailListQuery, MailMessage, MailPage, MailRow } from '../../shared/schemas/mail.js';
import { conflict, notFound } from '../errors.js';
import { findMailLog, listMailLog, requeueFailed } from './mail.repository.js';

type Row = NonNullable<Awaited<ReturnType<typeof findMailLog>>>;

const present = (r: Row): MailRow => ({
  id: r.id, toAddress: r.toAddress, subject: r.subject, kind: r.kind, status: r.status as MailRow['status'], attempts: r.attempts,
  nextAttemptAt: r.nextAttemptAt.toISOString(), fileName: r.fileName, error: r.error, createdAt: r.createdAt.toISOString(), sentAt: r.sentAt?.toISOString() ?? null,
});

/** The outbox page: what waits, what was sent and what is failing; a failed message can be sent again. */
export function makeMailService({ db, clock, config, mailer, audit }: Deps) {
  async function list(q: MailListQuery): Promise<MailPage> {
    const { items, total, counts } = await listMailLog(db, q);
    return { items: items.map(present), total, page: q.page, pageSize: q.pageSize, counts };
  }

  async function get(id: string): Promise<MailMessage> {
    const row = await findMailLog(db, id);
    if (!row) throw notFound('That message');
    const raw = row.fileName ? await readFile(path.join(config.mail.outboxDir, path.basename(row.fileName)), 'utf8').catch(() => null) : null;
    return { ...present(row), raw, text: row.body };
  }

  async function retry(actorId: string, id: string): Promise<MailRow> {
    const row = await db.transaction(async (tx) => {
      const before = await findMailLog(tx, id, true);
      if (!before) throw notFound('That message');
      if (before.status !== 'failed') throw conflict(`This message is ${before.status}; only a failed message can be retried.`);
      const after = await requeueFailed(tx, id, clock.now());
      if (!after) throw conflict('This message was recorded before the outbox kept message text, so it cannot be sent again.');
      await audit(tx, { actorId, action: 'mail.retried', entity: 'mail_log', entityId: id, oldValues: { status: before.status, attempts: before.attempts, error: before.error }, newValues: { status: 'waiting' } });
      return after;
    });
    await mailer.wake();
    return present(row);
  }

  return { list, get, retry };
}
export type MailService = ReturnType<typeof makeMailService>;
