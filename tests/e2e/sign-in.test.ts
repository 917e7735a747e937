import { describe, it, expect, beforeAll } from 'vitest';
import { startBrowserApp } from '../support/browser.js';
import { DEMO_SIGN_INS } from '../../server/seed/demo-people.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
beforeAll(async () => {
  b = await startBrowserApp();
});

describe('signing in through the browser', () => {
  for (const { role, email } of DEMO_SIGN_INS) {
    it(`when the demo ${role} signs in, then their own home page shows`, async () => {
      const page = await b.signInPage(email);
      await page.getByTestId(`home-${role}`).waitFor({ timeout: 15_000 });
      expect(await page.getByTestId(`home-${role}`).isVisible()).toBe(true);
      await page.context().close();
    });
  }

  it('when the password is wrong, then the page says so and stays on sign-in', async () => {
    const page = await b.newPage();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(DEMO_SIGN_INS[0].email);
    await page.getByLabel('Password', { exact: true }).fill('certainly-not-the-password');
    await page.getByRole('button', { name: /sign in/i }).click();
    await page.getByText('E-mail or password is not right.').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.context().close();
  });
});
