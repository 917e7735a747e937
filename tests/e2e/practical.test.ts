import { describe, it, expect, beforeAll } from 'vitest';
import { startBrowserApp } from '../support/browser.js';
import { chooseOption } from '../support/choose.js';
import { PUBLIC_URL } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { publishRecordsProcedure } from '../support/records.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
beforeAll(async () => {
  // The API agents below send Origin: PUBLIC_URL of the test app; the browser's origin is the app's own.
  b = await startBrowserApp({ env: { EXTRA_ORIGINS: PUBLIC_URL } });
  proc = await publishRecordsProcedure(b);
});

describe('a practical recorded at the bench in the browser', () => {
  it('when the assessor records a reading out of tolerance, then it shows as failed with the expected value beside it', async () => {
    const page = await b.signInPage(DEMO.assessor);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'At your sites' }).click();
    await page.getByRole('link', { name: 'Open a practical' }).click();
    await page.getByRole('heading', { name: 'Open a practical' }).waitFor();
    const choose = async (label: string, option: RegExp) => {
      // Vuetify's field overlays its input: the click lands on the field, as a finger would.
      await page.getByRole('combobox', { name: label }).click({ force: true });
      await page.getByRole('option', { name: option }).click();
    };
    await choose('Technician assessed', /Tomasz Wójcik/);
    await choose('Bench', /^LEJ-B1/);
    await choose('Procedure (version in force)', new RegExp(proc.version.code));
    await page.getByText('Assessor checklist', { exact: true }).waitFor();
    await page.getByRole('table', { name: 'Expected values' }).waitFor();
    await page.getByRole('button', { name: 'Open the practical' }).click();

    await page.waitForURL(/\/practicals\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: /^Practical: / }).waitFor();
    expect(await page.getByRole('note').filter({ hasText: 'Live parts: work to the procedure; stop at each hold point.' }).isVisible()).toBe(true);
    expect(await page.getByText('HOLD POINT 1', { exact: true }).isVisible()).toBe(true);
    await page.getByRole('button', { name: 'Compact list' }).click();
    // The site's instruments arrive after the practical itself.
    await page.waitForLoadState('networkidle');

    const volts = page.getByRole('article', { name: /Output RMS voltage/ });
    const reading = volts.getByLabel('Reading in V');
    expect(await reading.getAttribute('inputmode')).toBe('decimal');
    await reading.fill('150');
    await chooseOption(page, volts, 'Instrument used', 'Ohmwerk DM 61 SN OW61-20417');
    await volts.getByRole('button', { name: 'Record the reading' }).click();
    const judged = volts.getByRole('complementary', { name: /Expected value and verdict/ });
    await judged.getByTestId('verdict').filter({ hasText: /^\s*Outside the rule: failed\s*$/ }).waitFor();
    expect(await judged.getByTestId('expected').textContent()).toMatch(/^Expected 190\.\d V$/);
    expect(await judged.getByTestId('tolerance').textContent()).toMatch(/^± 5 % \(± 9\.\d+ V\)$/);
    expect(await judged.textContent()).toContain('Recorded 150 V with Ohmwerk DM 61 SN OW61-20417');

    const angle = page.getByRole('article', { name: /Firing angle/ });
    await angle.getByLabel('Reading in °').fill('74,5');
    await chooseOption(page, angle, 'Instrument used', 'Brightline DP 70 SN BL70-5531');
    await angle.getByRole('button', { name: 'Record the reading' }).click();
    await angle.getByTestId('verdict').filter({ hasText: /^\s*Within the rule: passed\s*$/ }).waitFor();
    expect(await page.getByTestId('progress').textContent()).toBe('1 of 4 complete');

    // What the screen shows is what the server stored.
    const id = new URL(page.url()).pathname.split('/').pop()!;
    const manager = await signIn(b, DEMO.manager);
    const stored = (await manager.get(`/api/practicals/${id}`)).body.items.find((i: { prompt: string }) => i.prompt === 'Output RMS voltage');
    expect(stored.entry).toMatchObject({ value: 150, unit: 'V', verdict: 'fail' });

    await page.getByRole('radio', { name: 'Not yet competent' }).check();
    await page.getByLabel('Comment for the record').fill('Output far below the expected value; the set-up was not checked first.');
    await page.getByRole('textbox', { name: "Assessor's password, to sign" }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign the outcome' }).click();
    await page.getByRole('heading', { name: 'Tomasz Wójcik: acknowledge the outcome' }).waitFor();
    await page.getByRole('textbox', { name: "Technician's own password" }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign as Tomasz Wójcik' }).click();
    await page.getByText('Signed by both').waitFor();
    expect(await page.getByRole('list', { name: 'Signatures' }).textContent()).toContain('“outcome acknowledged”');
    await page.context().close();
  });
});
