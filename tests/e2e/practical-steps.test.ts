import { describe, it, expect, beforeAll } from 'vitest';
import { startBrowserApp } from '../support/browser.js';
import { chooseOption } from '../support/choose.js';
import { PUBLIC_URL } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { CIRCUIT, lookups } from '../support/records.js';
import { linkedProcedure } from '../support/linked-procedure.js';
import { publishNew } from '../support/procedures.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
let practicalId: string;
beforeAll(async () => {
  // The API agents below send Origin: PUBLIC_URL of the test app; the browser's origin is the app's own.
  b = await startBrowserApp({ env: { EXTRA_ORIGINS: PUBLIC_URL } });
  const proc = await publishNew(await signIn(b, DEMO.manager), await signIn(b, DEMO.manager2), linkedProcedure().draft());
  const assessor = await signIn(b, DEMO.assessor);
  const tech = await signIn(b, DEMO.technician);
  const ids = await lookups(assessor);
  const opened = await assessor.post('/api/practicals').send({ technicianId: tech.user.id, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [ids.instruments['OW61-20417']], circuit: CIRCUIT });
  expect(opened.status, JSON.stringify(opened.body)).toBe(201);
  practicalId = opened.body.id;
});

describe('the procedure steps at the bench', () => {
  it('when the practical opens, then its steps show in order with their cautions; a reading of a later step is refused on screen naming the hold point', async () => {
    const page = await b.signInPage(DEMO.assessor);
    await page.goto(`/practicals/${practicalId}`);
    await page.getByRole('heading', { name: 'Procedure steps' }).waitFor();
    expect(await page.getByRole('note').filter({ hasText: 'Live parts: work to the procedure; stop at each hold point.' }).isVisible()).toBe(true);
    const steps = page.getByRole('list', { name: 'Procedure steps' }).getByRole('listitem');
    expect(await steps.count()).toBe(4);
    const third = page.getByRole('listitem', { name: 'Step 3' });
    expect(await third.textContent()).toContain('Caution: Hands clear of the output while energised.');
    expect(await page.getByRole('listitem', { name: 'Step 2' }).textContent()).toContain('Hold point');
    expect(await page.getByRole('listitem', { name: 'Step 1' }).getAttribute('aria-current')).toBe('step');
    const link = page.getByRole('link', { name: /^Open .* version 1$/ });
    expect(await link.getAttribute('href')).toMatch(/^\/procedures\/[0-9a-f-]{36}\/versions\/[0-9a-f-]{36}$/);
    expect((await link.boundingBox())!.height).toBeGreaterThanOrEqual(48);

    await page.getByRole('button', { name: 'Compact list' }).click();
    await page.waitForLoadState('networkidle');
    const volts = page.getByRole('article', { name: /Output RMS voltage/ });
    await volts.getByLabel('Reading in V').fill('188');
    await chooseOption(page, volts, 'Instrument used', 'Ohmwerk DM 61 SN OW61-20417');
    await volts.getByRole('button', { name: 'Record the reading' }).click();
    const refusal = volts.getByRole('alert').filter({ hasText: 'hold point 1 (step 2: "Connections checked before switch-on.") is not witnessed yet' });
    await refusal.waitFor();
    expect(await refusal.textContent()).toContain('Step 3 cannot be recorded yet');
    await page.context().close();
  });
});
