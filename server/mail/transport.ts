import { mkdirSync } from 'node:fs';
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import nodemailer from 'nodemailer';

export interface MailConfig {
  outboxDir: string;
  from: string;
  smtpUrl?: string;
}

/** One message as the transport receives it: its Message-ID is the outbox row's, the same on every attempt. */
export interface WireMessage {
  id: string;
  messageId: string;
  to: string;
  subject: string;
  text: string;
  createdAt: Date;
}

export interface MailTransport {
  /** Hands the message over; resolves once the mail server (or the outbox folder) has it, throws otherwise. */
  send(message: WireMessage): Promise<{ fileName: string | null }>;
}

/**
 * SMTP when SMTP_URL is set; otherwise every message is written as an .eml file into the outbox folder,
 * a local stand-in for a mail server that a demo or a test can read. The file is named by the row, so a
 * second attempt at the same message rewrites the same file.
 */
export function createTransport(cfg: MailConfig): MailTransport {
  const envelope = (m: WireMessage) => ({ from: cfg.from, to: m.to, subject: m.subject, text: m.text, messageId: m.messageId });
  if (cfg.smtpUrl) {
    const smtp = nodemailer.createTransport(cfg.smtpUrl);
    return {
      async send(m) {
        await smtp.sendMail(envelope(m));
        return { fileName: null };
      },
    };
  }
  mkdirSync(cfg.outboxDir, { recursive: true });
  const file = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' });
  return {
    async send(m) {
      const info = await file.sendMail(envelope(m));
      const fileName = `${m.createdAt.toISOString().replace(/[:.]/g, '-')}-${m.id}.eml`;
      await writeFile(path.join(cfg.outboxDir, fileName), info.message as Buffer);
      return { fileName };
    },
  };
}
