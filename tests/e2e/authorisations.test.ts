import { describe, it, expect, beforeAll } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { startBrowserApp } from '../support/browser.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';
import { makeScope, newPerson, PERSON_PASSWORD, submitCertificate, verifyCertificate } from '../support/authorisations.js';
import type { TestApp } from '../support/app.js';

let b: Awaited<ReturnType<typeof startBrowserApp>>;
beforeAll(async () => {
  b = await startBrowserApp();
});
const app = () => b as unknown as TestApp;

describe('authorisations in the browser', () => {
  it('when a practical marked competent gets its last signature, then the technician sees the issued authorisation, opens its certificate and the public page confirms it', async () => {
    const manager = await signIn(b, DEMO.manager);
    const assessor = await signIn(b, DEMO.assessor);
    const proc = await publishRecordsProcedure(app());
    const ids = await lookups(assessor);
    const scope = await makeScope(manager, {
      title: 'Live testing of phase-angle dimmers behind an isolating transformer', allowsLiveWork: true, certificateGraceDays: 14,
      requirements: [{ kind: 'procedure_ack', procedureId: proc.id }, { kind: 'practicals', procedureId: proc.id, count: 1, windowMonths: 12 }, { kind: 'certificate', certificateKind: 'first_aid_cpr' }],
    });
    const tech = await newPerson(app(), { name: 'Oskar Węgrzyn' });
    await tech.post(`/api/procedures/${proc.id}/versions/${proc.versionId}/acknowledge`).send({ password: PERSON_PASSWORD });
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2028-01-05' }), DEMO_PASSWORD);
    // The assessor has recorded the practical and signed the outcome; the technician's signature is the last one.
    const p = (await assessor.post('/api/practicals').send({ technicianId: tech.id, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [], circuit: CIRCUIT })).body;
    for (const h of p.holdPoints) await assessor.post(`/api/practicals/${p.id}/hold-points/${h.stepKey}`).send({});
    for (const [prompt, entry] of [
      ['The technician proved dead', { checked: true }],
      ['Firing angle', { value: 72, unit: '°', instrumentId: ids.instruments['BL70-5531'] }],
      ['Output RMS voltage', { value: 191, unit: 'V', instrumentId: ids.instruments['OW61-20417'] }],
      ['Bench RCD', { value: 24, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] }],
    ] as const) await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, prompt).id}`).send(entry);
    expect((await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'competent', comment: 'Proved dead, set up and measured safely.', password: DEMO_PASSWORD })).status).toBe(200);

    const bench = await b.signInPage(DEMO.assessor);
    await bench.goto(`/practicals/${p.id}`);
    await bench.getByRole('heading', { name: 'Oskar Węgrzyn: acknowledge the outcome' }).waitFor();
    await bench.getByLabel("Technician's e-mail").fill(tech.email);
    await bench.getByLabel("Technician's own password", { exact: true }).fill(PERSON_PASSWORD);
    await bench.getByRole('button', { name: 'Sign as Oskar Węgrzyn' }).click();
    await bench.getByRole('heading', { name: 'Oskar Węgrzyn: acknowledge the outcome' }).waitFor({ state: 'detached' });
    await bench.context().close();

    const page = await b.signInPage(tech.email, PERSON_PASSWORD);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'What I may do' }).click();
    const card = page.getByRole('region', { name: scope.title }).or(page.locator('.v-card', { has: page.getByRole('heading', { name: scope.title }) }));
    await card.first().waitFor();
    expect(await card.first().textContent()).toMatch(/In force.*up to 250 V and 10 A · live work within these limits.*Valid 2026-03-02 to 2027-03-02, 365 days left/s);
    expect(await page.getByTestId('authorisation-caution').textContent()).toMatch(/covers only the work, voltage and current stated on it/);

    const href = await card.first().getByRole('link', { name: 'Certificate (PDF)' }).getAttribute('href');
    const pdf = await page.request.get(href!);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(await pdf.body()) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    const code = /Verification code: ([A-Z2-7]{32})/.exec(text)?.[1];
    expect(code).toBeTruthy();
    expect(text).toContain('Oskar Węgrzyn');
    expect(text).toContain(`${b.baseUrl}/verify/${code}`);
    expect(text).toMatch(/Competent on 2 Mar 2026 against .* version 1, assessed by Priya Natarajan/);

    const stranger = await b.newPage();
    await stranger.goto(`/verify/${code}`);
    const result = stranger.getByTestId('verify-result');
    await result.waitFor();
    expect((await result.innerText()).replace(/\s+/g, ' ')).toMatch(/Current Holder Oskar Węgrzyn Scope Live testing of phase-angle dimmers behind an isolating transformer Valid 2026-03-02 to 2027-03-02/);
    expect(await stranger.getByRole('navigation', { name: 'Main navigation' }).count(), 'no sign-in, no navigation').toBe(0);
    await stranger.goto('/verify/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA');
    await stranger.getByText('Not found.').waitFor();
    await page.context().close();
    await stranger.context().close();
  });

  it('when a manager checks the certificate that completes a scope, then the authorisation is issued and its history shows who signed', async () => {
    const page = await b.signInPage(DEMO.manager);
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Certificates' }).click();
    const row = page.getByRole('row', { name: /Tomasz Wójcik.*First aid/ });
    await row.getByRole('button', { name: 'Check' }).click();
    // No scan is on file for this demo certificate: the manager states they saw the original in person.
    await page.getByLabel('I saw the original certificate in person').check();
    await page.getByLabel('Where you saw it').fill('Leipzig workshop office');
    await page.getByLabel('Your password, to sign', { exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign as checked' }).click();
    await page.getByText(/Tomasz Wójcik's First aid certificate is checked/).waitFor();

    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Due for renewal' }).click();
    const due = page.getByRole('row', { name: /Tomasz Wójcik.*DEAD-MAINS/ });
    await due.waitFor();
    expect(await due.textContent(), 'the re-read deadline of BO-ISO-01 ends it first').toMatch(/In force/);
    await due.getByRole('link', { name: 'Open' }).click();
    await page.getByTestId('authorisation-state').filter({ hasText: 'In force' }).waitFor();
    expect(await page.getByRole('table').first().textContent()).toMatch(/Issued.*The portal/);
    await page.context().close();
  });
});
