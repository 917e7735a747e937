import { mkdirSync } from 'node:fs';
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import nodemailer from 'nodemailer';
import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import { insertMailLog, insertMailLogs, type MailLogInsert } from './mail.repository.js';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  kind: string;
}

export interface MailConfig {
  outboxDir: string;
  from: string;
  smtpUrl?: string;
}

export interface SendOptions {
  /** Where the mail log row goes: a batch's own transaction, so a batch records its sends together. */
  log?: Executor;
}

export type SendResult = { ok: true; id: string; fileName: string | null } | { ok: false; error: string };

export interface Mailer {
  /** Sends and records the message; throws when the transport fails (the failure is recorded too). */
  send(mail: OutgoingMail, opts?: SendOptions): Promise<{ id: string; fileName: string | null }>;
  /** Sends each message and records them all in one write; a failed one is reported in its place, not thrown. */
  sendAll(mails: OutgoingMail[], opts?: SendOptions): Promise<SendResult[]>;
}

/** Messages handed to the transport at once by sendAll. */
const IN_FLIGHT = 8;

/**
 * Without SMTP_URL every message is written as an .eml file into the outbox folder: a local stand-in
 * for a mail server that a demo or a test can read.
 */
export function createMailer(db: Executor, clock: Clock, cfg: MailConfig): Mailer {
  const smtp = cfg.smtpUrl ? nodemailer.createTransport(cfg.smtpUrl) : null;
  const file = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' });
  if (!smtp) mkdirSync(cfg.outboxDir, { recursive: true });

  /** Hands one message to the transport; returns its mail log row either way, and the error if it failed. */
  async function transmit(mail: OutgoingMail): Promise<{ row: MailLogInsert; fileName: string | null; error?: Error }> {
    const id = randomUUID();
    const message = { from: cfg.from, to: mail.to, subject: mail.subject, text: mail.text, messageId: `<${id}@breakover.invalid>` };
    const base = { id, toAddress: mail.to, subject: mail.subject, kind: mail.kind, createdAt: clock.now(), messageId: message.messageId };
    try {
      let fileName: string | null = null;
      if (smtp) {
        await smtp.sendMail(message);
      } else {
        const info = await file.sendMail(message);
        const stamp = clock.now().toISOString().replace(/[:.]/g, '-');
        fileName = `${stamp}-${id}.eml`;
        await writeFile(path.join(cfg.outboxDir, fileName), info.message as Buffer);
      }
      return { row: { ...base, status: 'sent', fileName, sentAt: clock.now() }, fileName };
    } catch (err) {
      return { row: { ...base, status: 'failed', error: (err as Error).message.slice(0, 1000) }, fileName: null, error: err as Error };
    }
  }

  return {
    async send(mail, opts = {}) {
      const r = await transmit(mail);
      await insertMailLog(opts.log ?? db, r.row);
      if (r.error) throw r.error;
      return { id: r.row.id!, fileName: r.fileName };
    },
    async sendAll(mails, opts = {}) {
      const done: { row: MailLogInsert; fileName: string | null; error?: Error }[] = [];
      for (let i = 0; i < mails.length; i += IN_FLIGHT) done.push(...(await Promise.all(mails.slice(i, i + IN_FLIGHT).map(transmit))));
      await insertMailLogs(opts.log ?? db, done.map((d) => d.row));
      return done.map((d): SendResult => (d.error ? { ok: false, error: d.error.message } : { ok: true, id: d.row.id!, fileName: d.fileName }));
    },
  };
}
