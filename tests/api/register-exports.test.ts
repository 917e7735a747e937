import { describe, it, expect, beforeAll } from 'vitest';
import { parse } from 'csv-parse/sync';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { buildRegisterScenario, type RegisterScenario } from '../support/register.js';

let t: TestApp;
let s: RegisterScenario;
let auditor: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  s = await buildRegisterScenario(t, 'Exp');
  auditor = await signIn(t, DEMO.auditor);
});

const filter = () => ({ scopeId: s.scope.id, at: '2026-03-11T12:00:00Z', state: 'active', liveWork: 'true' });
const exportsInTrail = async () => (await t.ownerQuery(`select new_values from audit_log where action = 'register.exported' order by id`)).rows.map((r) => r.new_values);

describe('register exports', () => {
  it('when exported as CSV for a known filter, then the head states the moment and who, and the lines are exactly the rows in force then', async () => {
    t.clock.set('2026-06-05T12:30:00Z');
    const res = await asBytes(auditor.get('/api/register/export.csv').query(filter()));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toContain('register-2026-03-11T120000Z.csv');
    const lines = parse((res.body as Buffer).toString('utf8'), { relax_column_count: true, skip_empty_lines: false }) as string[][];
    expect(lines[0][0]).toMatch(/^Register as it stood at 11 Mar 2026, 13:00 CET \(2026-03-11T12:00:00.000Z\)$/);
    expect(lines[1][0]).toBe('Read: As it took effect (including what was recorded later)');
    expect(lines[2][0]).toBe(`Filter: scope ${s.scope.code}, state In force, scopes that allow live work`);
    expect(lines[3][0]).toBe('Produced 2026-06-05T12:30:00.000Z by Sigrún Hallsdóttir');
    const header = lines[5];
    expect(header.slice(0, 4)).toEqual(['Person', 'Site', 'Scope code', 'Scope']);
    const rows = lines.slice(6).filter((l) => l.length > 1);
    expect(rows.map((r) => r[0])).toEqual([s.people.a.name, s.people.c.name, s.people.d.name, s.people.f.name]);
    const a = Object.fromEntries(header.map((h, i) => [h, rows[0][i]]));
    expect(a).toMatchObject({
      Site: 'LEJ-W1', 'Scope code': s.scope.code, 'Live work': 'yes', 'Max voltage (V)': '250', State: 'In force', 'Valid from': '2026-03-02', 'Valid until': '2026-06-02',
      'Recorded from before the portal': 'no', 'Authorisation id': s.ids.a,
    });
    expect(rows[3][header.indexOf('Recorded from before the portal')]).toBe('yes');
    const [entry] = (await exportsInTrail()).slice(-1);
    expect(entry).toMatchObject({ format: 'csv', at: '2026-03-11T12:00:00.000Z', rows: 4, filter: { state: 'active', liveWork: 'true', scopeId: s.scope.id } });
    expect(entry.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('when exported as PDF, then its text names the moment, when it was produced and by whom, and each row with its state', async () => {
    t.clock.set('2026-06-05T12:40:00Z');
    const res = await asBytes(auditor.get('/api/register/export.pdf').query({ scopeId: s.scope.id, at: '2026-03-16T12:00:00Z' }));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('Register of authorisations');
    expect(text).toContain('Register as it stood at 16 Mar 2026, 13:00 CET (2026-03-16T12:00:00.000Z)');
    expect(text).toContain('Produced 05 Jun 2026, 14:40 CEST by Sigrún Hallsdóttir');
    expect(text).toContain('5 row(s).');
    expect(text).toContain(`${s.people.d.name} · LEJ-W1 · ${s.scope.code}`);
    expect(text).toContain('Revoked since 15 Mar 2026, 11:00 CET');
    expect(text).toContain('recorded from before the portal');
    expect(text).toContain('No findings recorded.');
    expect((await exportsInTrail()).at(-1)).toMatchObject({ format: 'pdf', rows: 5, at: '2026-03-16T12:00:00.000Z' });
  });

  it('when a technician asks for either export, then it is refused and nothing is written to the trail', async () => {
    const before = (await exportsInTrail()).length;
    expect((await s.people.a.get('/api/register/export.csv')).status).toBe(403);
    expect((await s.people.a.get('/api/register/export.pdf')).status).toBe(403);
    expect((await exportsInTrail()).length).toBe(before);
  });

  it('when the moment is in a wrong form, then the export answers 400 naming it and nothing is written', async () => {
    const before = (await exportsInTrail()).length;
    const res = await auditor.get('/api/register/export.csv').query({ at: 'yesterday' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('query.at');
    expect((await exportsInTrail()).length).toBe(before);
  });
});
