import { describe, it, expect, beforeAll } from 'vitest';
import JSZip from 'jszip';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { parseEml } from '../support/mail.js';
import { PERSON_PASSWORD, makeScope, newPerson, type Person } from '../support/authorisations.js';
import { nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';

// One rule: an earlier acknowledgement counts until the end of the re-read deadline, and says so everywhere.
let t: TestApp;
let auditor: Awaited<ReturnType<typeof signIn>>;
let tech: Person;
let mailText: string;

beforeAll(async () => {
  t = await makeTestApp();
  const manager = await signIn(t, DEMO.manager);
  const manager2 = await signIn(t, DEMO.manager2);
  auditor = await signIn(t, DEMO.auditor);
  t.clock.set('2026-03-02T10:00:00Z');
  const p = await publishNew(manager, manager2, { title: 'Live adjustment of a heater regulator' });
  await makeScope(manager, { allowsLiveWork: true, requirements: [{ kind: 'procedure_ack', procedureId: p.id }] });
  tech = await newPerson(t, { name: 'Oskar Lindqvist' });
  expect((await tech.post(`/api/procedures/${p.id}/versions/${p.versionId}/acknowledge`).send({ password: PERSON_PASSWORD })).status).toBe(201);
  t.clock.set('2026-03-03T10:00:00Z');
  const v2 = await nextDraft(manager, p.id, (v) => ({
    changeClass: 're-read', changeSummary: 'The regulator is adjusted with an insulated trimming tool only.', rereadDays: 10,
    steps: v.steps.map((s: { text: string }, i: number) => (i === 1 ? { ...s, text: 'Adjust the set point with an insulated trimming tool only.' } : s)),
  }));
  const before = new Set(t.mails());
  await submitAndApprove(manager, manager2, p.id, v2.id);
  const mine = (await Promise.all(t.mails().filter((m) => !before.has(m)).map(parseEml))).find((m) => m.to === tech.email);
  mailText = mine!.text.replace(/\s+/g, ' ');
  t.clock.set('2026-03-20T09:00:00Z');
});

async function packText(at: string) {
  const res = await asBytes(auditor.post('/api/incident-packs').send({ personId: tech.id, at }));
  expect(res.status).toBe(200);
  const zip = await JSZip.loadAsync(res.body as Buffer);
  const parser = new PDFParse({ data: new Uint8Array(await zip.file('incident-pack.pdf')!.async('uint8array')) });
  const text = (await parser.getText()).text.replace(/\s+/g, ' ');
  await parser.destroy();
  return text;
}

describe('the re-read rule', () => {
  it('when a re-read version is published, then the e-mail says the earlier acknowledgement still counts until the deadline, not to stop relying on it', () => {
    expect(mailText).toContain('Your acknowledgement of the earlier version still counts until the end of 2026-03-13; from then on only an acknowledgement of version 2 counts');
    expect(mailText).not.toContain('do not rely on the earlier version');
  });

  it('when the incident pack is made before the deadline, then the earlier acknowledgement is still counted and the authorisation resting on it stood', async () => {
    const text = await packText('2026-03-10T12:00:00Z');
    expect(text).toContain('acknowledged version 1 on 02 Mar 2026');
    expect(text).toContain('an earlier version, still counted until the end of 2026-03-13 (re-read deadline)');
    expect(text).not.toContain('no longer counted');
    expect(text).toMatch(/Test scope \d+: In force since/);
  });

  it('when the incident pack is made after the deadline, then the earlier acknowledgement is no longer counted', async () => {
    const text = await packText('2026-03-16T12:00:00Z');
    expect(text).toContain('an earlier version, no longer counted: the re-read deadline 2026-03-13 had passed');
  });
});
