import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import nodemailer from 'nodemailer';
import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import { insertMailLog } from './mail.repository.js';

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

export interface Mailer {
  /** Sends and records the message; throws when the transport fails (the failure is recorded too). */
  send(mail: OutgoingMail): Promise<{ id: string; fileName: string | null }>;
}

/**
 * Without SMTP_URL every message is written as an .eml file into the outbox folder: a local stand-in
 * for a mail server that a demo or a test can read.
 */
export function createMailer(db: Executor, clock: Clock, cfg: MailConfig): Mailer {
  const smtp = cfg.smtpUrl ? nodemailer.createTransport(cfg.smtpUrl) : null;
  const file = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' });
  if (!smtp) mkdirSync(cfg.outboxDir, { recursive: true });

  return {
    async send(mail) {
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
          writeFileSync(path.join(cfg.outboxDir, fileName), info.message as Buffer);
        }
        await insertMailLog(db, { ...base, status: 'sent', fileName, sentAt: clock.now() });
        return { id, fileName };
      } catch (err) {
        await insertMailLog(db, { ...base, status: 'failed', error: (err as Error).message.slice(0, 1000) });
        throw err;
      }
    },
  };
}
