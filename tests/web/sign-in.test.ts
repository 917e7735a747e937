import { afterEach, describe, expect, it, vi } from 'vitest';
import SignInView from '@/views/SignInView.vue';
import { alertBoxes, fakeFetch, getByRole, messagesBeside, mountWith, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

async function fillAndSubmit(email: string, password: string) {
  await type(getByRole('textbox', 'E-mail'), email);
  await type(getByRole('textbox', 'Password'), password);
  getByRole('button', 'Sign in').click();
  await settle();
}

describe('the sign-in form', () => {
  it('when the server names a field, then its message shows beside that field', async () => {
    fakeFetch(() => ({
      status: 400,
      body: { error: { code: 'invalid_input', message: 'email: enter a valid e-mail address', fields: { email: 'enter a valid e-mail address' } } },
    }));
    await mountWith(SignInView, { user: null, path: '/sign-in' });
    await fillAndSubmit('not-an-address', 'whatever');
    expect(messagesBeside(getByRole('textbox', 'E-mail'))).toBe('enter a valid e-mail address');
    expect(alertBoxes()).toHaveLength(0);
  });

  it('when the credentials are wrong, then the message shows as an alert and the page stays', async () => {
    fakeFetch(() => ({ status: 401, body: { error: { code: 'bad_credentials', message: 'E-mail or password is not right.' } } }));
    const { router } = await mountWith(SignInView, { user: null, path: '/sign-in' });
    await fillAndSubmit('pat@example.test', 'wrong password');
    expect(alertBoxes()[0].textContent).toContain('E-mail or password is not right.');
    expect(router.currentRoute.value.name).toBe('sign-in');
  });

  it('when the account is locked, then the server says for how long', async () => {
    const message = 'Too many failed sign-ins: this account is locked for 15 more minute(s).';
    fakeFetch(() => ({ status: 401, body: { error: { code: 'locked', message } } }));
    await mountWith(SignInView, { user: null, path: '/sign-in' });
    await fillAndSubmit('pat@example.test', 'another try');
    expect(alertBoxes()[0].textContent).toContain(message);
  });

  it('when sign-in succeeds, then it sends the e-mail and password and goes where the person was heading', async () => {
    const calls = fakeFetch((c) => (c.method === 'POST' && c.url.pathname === '/api/session' ? { body: userWith(['manager']) } : undefined));
    const { router } = await mountWith(SignInView, { user: null, path: '/sign-in?redirect=/profile' });
    await fillAndSubmit('pat@example.test', 'the right password');
    expect(calls[0]).toMatchObject({ method: 'POST', body: { email: 'pat@example.test', password: 'the right password' } });
    // The lazy view is compiled on first use, which takes a moment in the test run.
    await vi.waitFor(() => expect(router.currentRoute.value.fullPath).toBe('/profile'), { timeout: 15_000 });
  });
});
