import { describe, it, expect, beforeAll } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { createDraft, draftBody, nextDraft, submitAndApprove } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, tech: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, tech] = await Promise.all([signIn(t, DEMO.manager), signIn(t, DEMO.manager2), signIn(t, DEMO.technician)]);
});

// Enough steps for several pages, and the symbols the standard PDF fonts cannot draw.
const steps = [
  { text: 'Set the firing angle α to 90° with the potentiometer and let the lamp settle.', holdPoint: false },
  { text: 'Check that the bleed resistor across the X2 capacitor reads 470 kΩ ± 5 %.', caution: 'Measure with the unit unplugged: the capacitor may still hold charge.', holdPoint: true },
  ...Array.from({ length: 40 }, (_, i) => ({ text: `Record reading ${i + 1}: the load current must stay ≤ 0.5 A at every setting.`, holdPoint: false })),
];

async function pdfText(agent: Agent, url: string) {
  const res = await agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toBe('application/pdf');
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  try {
    return await parser.getText();
  } finally {
    await parser.destroy();
  }
}

describe('procedure PDF', () => {
  it('when a published version prints, then Ω, α, ≤, the accented approver name, version, status and signature block parse back', async () => {
    // Dana writes it and Jörg Łukasik approves it, so his name is in the signature block.
    const d = await createDraft(manager2, { steps });
    await submitAndApprove(manager2, manager, d.id, d.versionId);
    const { text, pages } = await pdfText(tech, `/api/procedures/${d.id}/versions/${d.versionId}/pdf`);
    for (const s of ['Ω', 'α', '≤', '±', '°']) expect(text).toContain(s);
    expect(text).toContain(`${d.code} · Version 1 · Status: Published`);
    expect(text).toContain('Approved by: Jörg Łukasik');
    // The procedure is owned at Dana's site, Cleveland: 09:00 UTC is 04:00 there (UTC−5 in March before DST).
    expect(text).toContain('Signed: 02 Mar 2026, 04:00 GMT-5');
    expect(text).toContain('Meaning of the signature: "approved for use"');
    expect(text).toContain('Author: Dana Whitcombe');
    expect(text).toContain('Mains voltage can kill.');
    expect(text).toMatch(/HOLD POINT: stop\. A supervisor witnesses step 2/);
    expect(text).toContain('Caution: Measure with the unit unplugged');
    expect(text).toContain('Accept: In-service equipment insulation resistance: Class I');
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((p, i) => {
      expect(p.text).toContain('Uncontrolled when printed');
      expect(p.text).toContain(`Page ${i + 1} of ${pages.length}`);
      expect(p.text).not.toContain('NOT IN FORCE');
    });
  });

  it('when a version is superseded or still a draft, then every page says it is not in force', async () => {
    const d = await createDraft(manager, { steps });
    await submitAndApprove(manager, manager2, d.id, d.versionId);
    const v2 = await nextDraft(manager, d.id, (v) => ({ changeClass: 'editorial', changeSummary: 'Reading list shortened.', steps: v.steps.slice(0, 5) }));
    const draft = await pdfText(manager, `/api/procedures/${d.id}/versions/${v2.id}/pdf`);
    draft.pages.forEach((p) => expect(p.text).toContain('NOT IN FORCE: draft, not approved for use'));
    expect(draft.text).toContain('Not approved: this version is not for use.');
    expect(draft.text).toContain('Editorial: nothing is asked of anyone');
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const old = await pdfText(manager, `/api/procedures/${d.id}/versions/${d.versionId}/pdf`);
    expect(old.pages.length).toBeGreaterThan(1);
    old.pages.forEach((p) => expect(p.text).toContain('NOT IN FORCE: superseded on 02 Mar 2026, 10:00 CET'));
    expect(old.text).toContain('Status: Superseded');
  });

  it('when a technician asks for the PDF of a draft, then 404', async () => {
    const d = await createDraft(manager, draftBody());
    expect((await tech.get(`/api/procedures/${d.id}/versions/${d.versionId}/pdf`)).status).toBe(404);
  });
});
