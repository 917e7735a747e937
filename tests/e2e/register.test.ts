import { describe, it, expect, beforeAll } from 'vitest';
import { startBrowserApp } from '../support/browser.js';
import { DEMO } from '../support/people.js';
import { buildRegisterScenario, type RegisterScenario } from '../support/register.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
let s: RegisterScenario;
beforeAll(async () => {
  b = await startBrowserApp();
  s = await buildRegisterScenario(b, 'Web');
});

describe('the register in the browser', () => {
  it('when an auditor sets the register to a past moment and filters it, then the rows are those of that moment and a row opens its evidence', async () => {
    const page = await b.signInPage(DEMO.auditor);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Register' }).click();
    await page.getByRole('heading', { name: 'Register', exact: true }).waitFor();
    const table = page.getByRole('table', { name: 'Register' });

    // 11 March 13:00 in Leipzig: B suspended the day before, D not yet revoked.
    const moment = page.getByRole('group', { name: 'Moment' });
    await moment.getByLabel('Date').fill('2026-03-11');
    await moment.getByLabel('Time').fill('13:00');
    await page.waitForURL((u) => u.searchParams.get('at') === '2026-03-11T12:00:00.000Z');
    await page.getByRole('combobox', { name: 'Scope' }).click({ force: true });
    await page.getByRole('option', { name: new RegExp(s.scope.code) }).click();
    await expect.poll(() => table.getByRole('row').count()).toBe(1 + 5);
    await page.getByRole('combobox', { name: 'State' }).click({ force: true });
    await page.getByRole('option', { name: 'Suspended', exact: true }).click();
    await expect.poll(() => table.getByRole('row').count()).toBe(1 + 1);
    expect(await table.getByRole('row').nth(1).textContent()).toContain(s.people.b.name);

    await page.getByRole('button', { name: `Evidence for ${s.people.b.name}, ${s.scope.code}` }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: `Evidence: ${s.people.b.name}, ${s.scope.code}` }).waitFor();
    const events = dialog.getByRole('list', { name: 'Events' });
    await events.getByText(/^Suspended · 10 Mar 2026, 11:00/).waitFor();
    expect(await events.textContent()).toContain('Earthed probe clipped to the isolated side');
    expect(await events.textContent(), 'the reinstatement came after the moment').not.toContain('Reinstated');
    expect(await dialog.getByRole('list', { name: 'Requirements' }).textContent()).toContain('Current First aid and CPR certificate');
    await page.context().close();
  });

  it('when a technician opens the register address, then they are not shown it', async () => {
    const page = await b.signInPage(s.people.a.email, 'bench-person-for-authorisation-tests');
    await page.goto('/register');
    await page.waitForURL((u) => !u.pathname.startsWith('/register'));
    expect(await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Register' }).count()).toBe(0);
    await page.context().close();
  });
});
