import { afterEach, describe, expect, it, vi } from 'vitest';
import OutboxView from '@/views/OutboxView.vue';
import { decodeMail } from '@/composables/useMailText';
import { fakeFetch, getByRole, mountWith, settle, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

// As nodemailer 10 writes a plain-text message with non-ASCII names: quoted-printable, soft breaks inside the link.
const RAW = [
  'To: amelie@example.test',
  'Subject: Your Breakover account',
  'Content-Transfer-Encoding: quoted-printable',
  'Content-Type: text/plain; charset=utf-8',
  '',
  'Hello Am=C3=A9lie Fournier,',
  '',
  'Set your password here:',
  'http://127.0.0.1:3000/set-password?=',
  'token=3Dabcdefghij=',
  'klmnop',
  '',
].join('\n');

const row = {
  id: '30000000-0000-4000-8000-000000000001', toAddress: 'amelie@example.test', subject: 'Your Breakover account', kind: 'invite', status: 'sent', attempts: 1,
  nextAttemptAt: '2026-06-01T10:00:00.000Z', fileName: 'x.eml', error: null, createdAt: '2026-06-01T10:00:00.000Z', sentAt: '2026-06-01T10:00:01.000Z',
};
const failed = { ...row, id: '30000000-0000-4000-8000-000000000002', subject: 'Reset your Breakover password', kind: 'reset', status: 'failed', attempts: 12, error: '550 5.1.1 mailbox unavailable', sentAt: null };

describe('the outbox', () => {
  it('when a quoted-printable message is decoded, then its link comes out whole', () => {
    const { body, links } = decodeMail(RAW);
    expect(body).toContain('Hello Amélie Fournier,');
    expect(links).toEqual(['http://127.0.0.1:3000/set-password?token=abcdefghijklmnop']);
  });

  it('when the admin opens a message, then it is fetched and its text and link are shown', async () => {
    const calls = fakeFetch((c) => {
      if (c.url.pathname === '/api/mail') return { body: { items: [row], total: 1, page: 1, pageSize: 25, counts: { sent: 1 } } };
      if (c.url.pathname === `/api/mail/${row.id}`) return { body: { ...row, raw: RAW } };
      return undefined;
    });
    await mountWith(OutboxView, { user: userWith(['admin']), path: '/outbox' });
    expect(calls[0].url.search).toBe('?page=1&pageSize=25');
    getByRole('button', 'Open “Your Breakover account” to amelie@example.test').click();
    await settle();
    await vi.waitFor(() => expect(document.body.textContent).toContain('Links in this message'));
    const link = [...document.querySelectorAll('a')].find((a) => a.textContent?.includes('set-password'));
    expect(link?.getAttribute('href')).toBe('http://127.0.0.1:3000/set-password?token=abcdefghijklmnop');
  });

  it('when nothing has been sent, then it says so', async () => {
    fakeFetch((c) => (c.url.pathname === '/api/mail' ? { body: { items: [], total: 0, page: 1, pageSize: 25, counts: {} } } : undefined));
    await mountWith(OutboxView, { user: userWith(['admin']), path: '/outbox' });
    expect(document.body.textContent).toContain('No messages yet');
  });

  it('when a message has failed, then its error and attempts show, and Retry asks the server to send it again and reloads', async () => {
    let retried = false;
    const calls = fakeFetch((c) => {
      if (c.method === 'POST' && c.url.pathname === `/api/mail/${failed.id}/retry`) {
        retried = true;
        return { body: { ...failed, status: 'waiting', attempts: 0 } };
      }
      if (c.url.pathname === '/api/mail') {
        const item = retried ? { ...failed, status: 'sent', attempts: 1, error: null } : failed;
        return { body: { items: [item], total: 1, page: 1, pageSize: 25, counts: retried ? { sent: 1 } : { failed: 1 } } };
      }
      return undefined;
    });
    await mountWith(OutboxView, { user: userWith(['admin']), path: '/outbox' });
    expect(document.body.textContent).toContain('550 5.1.1 mailbox unavailable');
    expect(document.body.textContent).toContain('Failed (1)');
    expect([...document.querySelectorAll('tbody tr td')].map((td) => td.textContent?.trim()), 'the attempts column').toContain('12');
    getByRole('button', 'Retry “Reset your Breakover password” to amelie@example.test').click();
    await vi.waitFor(() => expect(document.body.textContent).toContain('Sent (1)'));
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.url.pathname)).toEqual([`/api/mail/${failed.id}/retry`]);
    expect(document.body.textContent).not.toContain('mailbox unavailable');
  });
});
