import type { Server } from 'node:http';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll } from 'vitest';
import { freePort } from '../../scripts/lib/ports.js';
import { makeTestApp, type TestAppOptions } from './app.js';
import { DEMO_PASSWORD } from './people.js';

const CHROMIUM_FLAGS = [
  '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update',
  '--disable-sync', '--no-first-run', '--disable-quic',
];

/**
 * The real app with the built client (dist/) on a free loopback port, and Debian's Chromium driven by
 * playwright-core. One per e2e test file; cleans up after the file.
 */
export async function startBrowserApp(opts: TestAppOptions = {}) {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const t = await makeTestApp({ ...opts, env: { PUBLIC_URL: baseUrl, STATIC_DIR: process.env.TEST_STATIC_DIR ?? path.resolve('dist'), ...opts.env } });
  const server: Server = await new Promise((resolve) => {
    const s = t.app.listen(port, '127.0.0.1', () => resolve(s));
  });
  const browser: Browser = await chromium.launch({
    executablePath: process.env.TEST_CHROMIUM ?? '/usr/bin/chromium',
    headless: true,
    // playwright-core gives every launch a fresh, empty profile folder of its own.
    args: CHROMIUM_FLAGS,
  });
  afterAll(async () => {
    await browser.close();
    await new Promise((r) => server.close(r));
  });

  async function newPage(): Promise<Page> {
    const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 860 } });
    return context.newPage();
  }

  /** Signs in through the sign-in form, as a person would. */
  async function signInPage(email: string, password = DEMO_PASSWORD): Promise<Page> {
    const page = await newPage();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: /sign in/i }).click();
    try {
      // Generous: on a loaded two-core machine the password hash and the first route's chunk take a while.
      await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 60_000 });
    } catch (err) {
      // Say what the page showed, so a failure here can be told from a slow machine.
      const alerts = await page.getByRole('alert').allTextContents().catch(() => []);
      throw new Error(`sign-in as ${email} did not leave ${page.url()} (alerts: ${JSON.stringify(alerts)}): ${(err as Error).message.split('\n')[0]}`);
    }
    return page;
  }

  return { ...t, baseUrl, browser, newPage, signInPage };
}
