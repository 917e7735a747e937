import { describe, it, expect, beforeAll } from 'vitest';
import { startBrowserApp } from '../support/browser.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';
import { makePng } from '../fixtures/evidence-files.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
beforeAll(async () => {
  b = await startBrowserApp();
});

describe('benches, pre-use checks and evidence in the browser', () => {
  it('when the manager opens Benches, then overdue and Type AC benches are flagged, and a new bench can be added', async () => {
    const page = await b.signInPage(DEMO.manager);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Benches' }).click();
    await page.getByRole('heading', { name: 'Benches', exact: true }).waitFor();
    expect(await page.getByRole('heading', { name: 'Mains voltage can kill' }).isVisible()).toBe(true);
    await expect.poll(() => page.getByRole('row', { name: /LEJ-B2/ }).textContent()).toContain('Inspection overdue');
    expect(await page.getByRole('row', { name: /CLE-B1/ }).textContent()).toContain('Type AC RCD — not suitable for phase-cut loads');

    await page.getByRole('button', { name: 'Add a bench' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Code').fill('LEJ-B4');
    await dialog.getByLabel('Name').fill('Triac repair bench');
    await dialog.getByLabel('Transformer rating').fill('800');
    await dialog.getByLabel('Next inspection').fill('2026-11-30');
    await dialog.getByRole('button', { name: 'Save the bench' }).click();
    await page.getByRole('row', { name: /LEJ-B4/ }).waitFor();
    expect(await page.getByRole('row', { name: /LEJ-B4/ }).textContent()).toContain('In order');
    await page.context().close();
  });

  it('when a technician signs a pre-use check and attaches a photo, then the photo shows with the check', async () => {
    const page = await b.signInPage(DEMO.technician);
    await page.goto('/benches');
    await page.getByRole('button', { name: 'Pre-use checks of LEJ-B1' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Passed: the bench is fit to use').check();
    await dialog.getByRole('textbox', { name: 'Your password, to sign' }).fill(DEMO_PASSWORD);
    await dialog.getByRole('button', { name: 'Sign the check' }).click();
    await dialog.getByText(/Passed · signed by Tomasz Wójcik/).waitFor();

    await dialog.getByLabel('Choose a file').setInputFiles({ name: 'rcd-test-button.png', mimeType: 'image/png', buffer: makePng(16, 12) });
    await dialog.getByRole('button', { name: 'Upload' }).click();
    const img = dialog.getByRole('img', { name: 'rcd-test-button.png' });
    await img.waitFor();
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(16);
    await page.context().close();
  });
});
