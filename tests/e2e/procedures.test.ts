import { describe, it, expect, beforeAll } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserApp } from '../support/browser.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
beforeAll(async () => {
  b = await startBrowserApp();
});

const CODE = 'E2E-DIM-01';
let versionPath = '';

async function openProcedure(page: Page) {
  await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Procedures' }).click();
  await page.getByRole('heading', { name: 'Procedures', exact: true }).waitFor();
  await page.getByRole('searchbox', { name: 'Search by code or title' }).fill(CODE);
  await page.getByRole('link', { name: CODE }).click();
  await page.getByRole('heading', { name: 'Steps' }).waitFor();
}

describe('a procedure from draft to acknowledgement in the browser', () => {
  it('when a manager writes a procedure and submits it, then it waits in review and they cannot approve it', async () => {
    const page = await b.signInPage(DEMO.manager);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Procedures' }).click();
    await page.getByRole('button', { name: 'New procedure' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Code').fill(CODE);
    await dialog.getByLabel('Title').fill('Replacing the triac in a lamp dimmer');
    await dialog.getByRole('button', { name: 'Create the draft' }).click();
    await page.getByRole('heading', { name: `Edit ${CODE} version 1` }).waitFor();

    await page.getByRole('textbox', { name: 'Scope', exact: true }).fill('Bench repair of a 230 V lamp dimmer, unit unplugged and proved dead.');
    await page.getByRole('button', { name: 'Add to hazards' }).click();
    await page.getByRole('textbox', { name: 'Hazards 1', exact: true }).fill('Stored charge in the X2 capacitor');
    // Submitting with no step: the message shows beside the steps and nothing is submitted.
    await page.getByRole('button', { name: 'Save and submit for review' }).click();
    await page.getByText('add at least one step').first().waitFor();

    await page.getByRole('button', { name: 'Add a step' }).click();
    await page.getByRole('textbox', { name: 'Step 1 text', exact: true }).fill('Unplug the unit and keep the plug in sight.');
    await page.getByRole('button', { name: 'Add a step' }).click();
    await page.getByRole('textbox', { name: 'Step 2 text', exact: true }).fill('Prove dead across the triac with a two-pole tester, proved before and after.');
    await page.getByLabel('Step 2 is a hold point: a supervisor witnesses it before work goes on').check();
    await page.getByRole('textbox', { name: 'Step 2 caution (optional)', exact: true }).fill('The X2 capacitor may still hold charge.');
    // Reordering: move step 2 up and back down again.
    await page.getByRole('button', { name: 'Move step 2 up' }).click();
    expect(await page.getByRole('textbox', { name: 'Step 1 text', exact: true }).inputValue()).toMatch(/^Prove dead/);
    await page.getByRole('button', { name: 'Move step 1 down' }).click();
    await page.getByRole('button', { name: 'Add a checklist' }).click();
    await page.getByRole('textbox', { name: 'Checklist 1 title', exact: true }).fill('Technician sign-off');
    await page.getByRole('textbox', { name: 'Item 1', exact: true }).fill('I proved the tester before and after the test.');
    expect(await page.getByText('Unsaved changes').isVisible()).toBe(true);

    await page.getByRole('button', { name: 'Save and submit for review' }).click();
    await page.getByRole('heading', { name: 'Replacing the triac in a lamp dimmer' }).waitFor();
    await page.getByText('This version is in review.').waitFor();
    versionPath = new URL(page.url()).pathname;
    expect(await page.getByText('You wrote or edited this version, so another manager must review it.').isVisible()).toBe(true);
    expect(await page.getByRole('button', { name: 'Approve and publish' }).count()).toBe(0);
    await page.context().close();
  });

  it('when another manager approves with their password, then the impact is shown first and the version is published', async () => {
    const page = await b.signInPage(DEMO.manager2);
    await page.goto(versionPath);
    await page.getByRole('button', { name: 'Approve and publish' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Nobody is asked to do anything.').waitFor();
    await dialog.getByRole('textbox', { name: 'Your password, to sign' }).fill('not-the-right-password');
    await dialog.getByRole('button', { name: 'Sign and publish' }).click();
    await dialog.getByText('the password is not right').waitFor();
    await dialog.getByRole('textbox', { name: 'Your password, to sign' }).fill(DEMO_PASSWORD);
    await dialog.getByRole('button', { name: 'Sign and publish' }).click();
    await page.getByText('v1 · Published').first().waitFor();
    expect(await page.getByText(/Dana Whitcombe, .*, meaning “approved for use”/).isVisible()).toBe(true);
    await page.context().close();
  });

  it('when a technician opens it, then the hold point and caution stand out, and they acknowledge it with their signature', async () => {
    const page = await b.signInPage(DEMO.technician);
    await openProcedure(page);
    expect(await page.getByRole('heading', { name: 'Mains voltage can kill' }).isVisible()).toBe(true);
    expect(await page.getByText('Stop before step 2 is done: a supervisor witnesses it before work goes on.').isVisible()).toBe(true);
    expect(await page.getByText('The X2 capacitor may still hold charge.').isVisible()).toBe(true);
    await page.getByRole('button', { name: 'Acknowledge this version' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('textbox', { name: 'Your password, to sign' }).fill(DEMO_PASSWORD);
    await dialog.getByRole('button', { name: 'Sign the acknowledgement' }).click();
    await page.getByText(/Tomasz Wójcik, .*, meaning “I will work to this version”/).waitFor();
    expect(await page.getByRole('button', { name: 'Acknowledge this version' }).count()).toBe(0);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Procedures' }).click();
    await page.getByRole('searchbox', { name: 'Search by code or title' }).fill(CODE);
    await expect.poll(() => page.getByRole('row', { name: new RegExp(CODE) }).textContent()).toContain('Acknowledged');
    await page.context().close();
  });
});
