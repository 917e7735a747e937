import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope } from '../support/authorisations.js';
import { changedTables, fingerprint } from '../support/fingerprint.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let code: string;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  code = (await makeScope(manager)).code;
});

const header = 'email,name,site,roles,scope,issued_on,expires_on,attested_by,note';
const row = (email: string, name: string, issued = '2025-03-01', attested = 'Heike Krause', note = '') =>
  [email, name, 'LEJ-W1', 'technician', code, issued, '2026-02-28', attested, note].map((c) => `"${c.replace(/"/g, '""')}"`).join(',');

describe('CSV import cells follow the same text and date rules as the forms', () => {
  it('when cells hold control characters, bidi overrides, invisible names or impossible dates, then each row names its problem, and neither run writes anything', async () => {
    const csv = [
      header,
      row('ok.person@example.test', 'Kasia Nowak'),
      row('nul.person@example.test', 'Ole\u0000Brandt'),
      row('rlo.person@example.test', 'Ana \u202eamiL'),
      row('ghost.person@example.test', '\u200b\u200b'),
      row('feb.person@example.test', 'Tim Beck', '2025-02-30'),
      row('year.person@example.test', 'Mia Vogel', '0000-01-01'),
      row('attest.person@example.test', 'Jan Kowal', '2025-03-01', '\u2066HK\u2069'),
      row('note.person@example.test', 'Eva Berg', '2025-03-01', 'Heike Krause', 'line one\nline two'),
    ].join('\n');
    const before = await fingerprint(t);
    const dry = await manager.post('/api/authorisations/import').send({ csv, dryRun: true });
    expect(dry.status).toBe(200);
    const problems = Object.fromEntries(dry.body.rows.map((r: { email: string; problems: string[] }) => [r.email.split('.')[0], r.problems]));
    expect(problems).toEqual({
      ok: [],
      nul: ['name: must not contain control characters'],
      rlo: ['name: must not contain characters that reverse the reading direction'],
      ghost: ['name: must contain something visible'],
      feb: ['issued_on: must be a real date between 1900 and 2199'],
      year: ['issued_on: must be a real date between 1900 and 2199'],
      attest: ['attested_by: must not contain characters that reverse the reading direction'],
      note: [],
    });
    const real = await manager.post('/api/authorisations/import').send({ csv, dryRun: false, password: DEMO_PASSWORD });
    expect(real.status).toBe(422);
    expect(real.body.error.fields['line 3']).toBe('name: must not contain control characters');
    expect(changedTables(before, await fingerprint(t))).toEqual([]);
  });
});
