import { describe, it, expect, beforeAll } from 'vitest';
import { startBrowserApp } from '../support/browser.js';
import { DEMO } from '../support/people.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
beforeAll(async () => {
  b = await startBrowserApp();
});

const angleIn = (text: string | null) => Number(/Firing angle ([\d.]+)°/.exec(text ?? '')?.[1]);

describe('the bench calculator in the browser', () => {
  it('when the demo technician moves the potentiometer slider, then the firing angle and the plot move with it', async () => {
    const page = await b.signInPage(DEMO.technician);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Bench calculator' }).click();
    await page.getByRole('heading', { name: 'Bench calculator' }).waitFor();
    expect(await page.getByRole('heading', { name: 'Mains voltage can kill' }).isVisible()).toBe(true);

    await page.getByRole('tab', { name: 'Trigger network' }).click();
    const readout = page.getByTestId('trigger-readout');
    await readout.filter({ hasText: 'Firing angle' }).waitFor();
    const before = angleIn(await readout.textContent());
    const plot = page.getByRole('img', { name: /^Trigger network, simulated/ });
    const pathBefore = await plot.locator('[data-series="output"]').getAttribute('d');

    const slider = page.getByRole('slider', { name: 'Potentiometer setting' });
    await slider.focus();
    for (let i = 0; i < 10; i++) await slider.press('ArrowRight');
    await expect.poll(async () => slider.getAttribute('aria-valuenow')).toBe('40');

    const after = angleIn(await readout.textContent());
    expect(after).toBeGreaterThan(before);
    expect(await plot.getAttribute('aria-label')).toContain(`fires ${after.toFixed(1)}° after each zero crossing`);
    expect(await plot.locator('[data-series="output"]').getAttribute('d')).not.toBe(pathBefore);
    expect(new URL(page.url()).pathname).toBe('/calculator');
    await page.context().close();
  });

  it('when the published limits tab is opened, then the presets come from the server with their sources', async () => {
    const page = await b.signInPage(DEMO.auditor);
    await page.goto('/calculator?tab=limits');
    const row = page.getByRole('row', { name: /0\.5×IΔn/ });
    await row.waitFor();
    expect(await row.textContent()).toContain('no trip within 300 ms');
    expect(await row.textContent()).toContain('IEC 61008-1');
    await page.context().close();
  });
});
