import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { afterAll } from 'vitest';

export interface Received {
  messageId: string;
  to: string[];
  subject: string;
  raw: string;
}

/**
 * A real SMTP server on 127.0.0.1 (a free port) that keeps what it accepts. While `refuse` is above zero it
 * answers the message with `code` (451: try again later; 550: refused for good) and counts down. Closed
 * after the file.
 */
export async function startSmtpPeer() {
  const received: Received[] = [];
  const state = { refuse: 0, code: 451, refused: 0 };
  const server = new SMTPServer({
    authOptional: true, disabledCommands: ['AUTH', 'STARTTLS'], logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if (state.refuse > 0) {
          state.refuse--;
          state.refused++;
          return callback(Object.assign(new Error(state.code >= 500 ? 'mailbox unavailable' : 'try again later'), { responseCode: state.code }));
        }
        const raw = Buffer.concat(chunks).toString('utf8');
        const header = (name: string) => raw.match(new RegExp(`^${name}:\\s*(.+)$`, 'mi'))?.[1].trim() ?? '';
        received.push({ raw, messageId: header('Message-ID'), subject: header('Subject'), to: session.envelope.rcptTo.map((a) => a.address) });
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.server.address() as AddressInfo;
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));
  return { url: `smtp://127.0.0.1:${port}`, received, state };
}
