import { simpleParser } from 'mailparser';

export interface ParsedMail {
  to: string;
  subject: string;
  text: string;
}

/** Decodes an .eml as a mail client would (headers, quoted-printable, character set). */
export async function parseEml(raw: string): Promise<ParsedMail> {
  const m = await simpleParser(raw);
  const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(', ') : (m.to?.text ?? '');
  return { to, subject: m.subject ?? '', text: m.text ?? '' };
}

export async function linkToken(raw: string): Promise<string> {
  const { text } = await parseEml(raw);
  const match = text.match(/\/set-password\?token=([A-Za-z0-9_-]+)/);
  if (!match) throw new Error(`no set-password link in:\n${text}`);
  return match[1];
}
