import { afterEach, describe, expect, it, vi } from 'vitest';
import SetPasswordView from '@/views/SetPasswordView.vue';
import { fakeFetch, getByRole, messagesBeside, mountWith, settle, type } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const TOKEN = 'a-link-token-that-is-long-enough-123';
const link = { email: 'amelie@example.test', name: 'Amélie Fournier', purpose: 'invite' };

describe('the set-password page', () => {
  it('when the link is good, then it shows whose account it is and the password rules', async () => {
    const calls = fakeFetch((c) => (c.url.pathname === '/api/password/link' ? { body: link } : undefined));
    await mountWith(SetPasswordView, { user: null, path: `/set-password?token=${TOKEN}` });
    expect(calls[0].url.searchParams.get('token')).toBe(TOKEN);
    expect(document.body.textContent).toContain('Amélie Fournier');
    expect(document.body.textContent).toContain('At least 15 characters and at most 128.');
  });

  it('when the server refuses a common password, then its reason shows beside the field', async () => {
    fakeFetch((c) =>
      c.url.pathname === '/api/password/link'
        ? { body: link }
        : { status: 422, body: { error: { code: 'unprocessable', message: 'password: this password is too common; choose another', fields: { password: 'this password is too common; choose another' } } } },
    );
    await mountWith(SetPasswordView, { user: null, path: `/set-password?token=${TOKEN}` });
    await type(getByRole('textbox', 'New password'), 'maple cobalt river thimble'); // passes the page's own check
    getByRole('button', 'Set the password').click();
    await vi.waitFor(() => expect(messagesBeside(getByRole('textbox', 'New password'))).toBe('this password is too common; choose another'));
  });

  it('when a common password with a year added is typed, then the page says so before anything is sent', async () => {
    const calls = fakeFetch((c) => (c.url.pathname === '/api/password/link' ? { body: link } : undefined));
    await mountWith(SetPasswordView, { user: null, path: `/set-password?token=${TOKEN}` });
    await type(getByRole('textbox', 'New password'), 'Password2024!!!!');
    await vi.waitFor(() => expect(messagesBeside(getByRole('textbox', 'New password'))).toMatch(/^this password is too common/), { timeout: 10_000 });
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it('when the password holds the person\'s name with accents dropped, then the page says so while typing', async () => {
    fakeFetch((c) => (c.url.pathname === '/api/password/link' ? { body: link } : undefined));
    await mountWith(SetPasswordView, { user: null, path: `/set-password?token=${TOKEN}` });
    await type(getByRole('textbox', 'New password'), 'amelie on the night bus');
    await vi.waitFor(() => expect(messagesBeside(getByRole('textbox', 'New password'))).toMatch(/do not use your name/), { timeout: 10_000 });
  });

  it('when the password is too short, then nothing is sent and the rule shows', async () => {
    const calls = fakeFetch((c) => (c.url.pathname === '/api/password/link' ? { body: link } : undefined));
    await mountWith(SetPasswordView, { user: null, path: `/set-password?token=${TOKEN}` });
    await type(getByRole('textbox', 'New password'), 'short');
    getByRole('button', 'Set the password').click();
    await settle();
    await vi.waitFor(() => expect(messagesBeside(getByRole('textbox', 'New password'))).toBe('Use at least 15 characters.'));
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it('when the link has been used, then the page says so', async () => {
    fakeFetch(() => ({ status: 404, body: { error: { code: 'not_found', message: 'That link (it may have been used or have expired) was not found.' } } }));
    await mountWith(SetPasswordView, { user: null, path: `/set-password?token=${TOKEN}` });
    expect(document.body.textContent).toContain('it may have been used or have expired');
  });
});
