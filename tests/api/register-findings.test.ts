import { describe, it, expect, beforeAll } from 'vitest';
import { parse } from 'csv-parse/sync';
import { PDFParse } from 'pdf-parse';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { newPerson, type Person } from '../support/authorisations.js';

let t: TestApp;
let auditor: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let manager2: Awaited<ReturnType<typeof signIn>>;
let tech: Person;

beforeAll(async () => {
  t = await makeTestApp();
  auditor = await signIn(t, DEMO.auditor);
  manager = await signIn(t, DEMO.manager);
  manager2 = await signIn(t, DEMO.manager2);
  tech = await newPerson(t, { name: 'Kofi Mensah' });
});

const raise = (body: Record<string, unknown>) => auditor.post('/api/findings').send({ severity: 'major', text: 'Pre-use check skipped twice in one week.', ...body });

describe('findings', () => {
  it('when an auditor raises one against a record, then it names the record and its site; a missing record is 422 and nothing is written', async () => {
    const res = await raise({ entity: 'person', entityId: tech.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ recordLabel: 'Person: Kofi Mensah', siteName: 'Leipzig bench workshop', status: 'open', severityLabel: 'Major non-conformity', raisedBy: 'Sigrún Hallsdóttir' });
    const before = (await auditor.get('/api/findings')).body.total;
    const missing = await raise({ entity: 'bench', entityId: '00000000-0000-4000-8000-000000000000' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty('entityId');
    expect((await raise({ entity: 'bench', entityId: 'x', severity: 'huge' })).body.error.fields).toHaveProperty('severity');
    expect((await auditor.get('/api/findings')).body.total).toBe(before);
  });

  it('when managers and technicians try to raise one, then they are refused', async () => {
    expect((await manager.post('/api/findings').send({ entity: 'person', entityId: tech.id, severity: 'minor', text: 'Something' })).status).toBe(403);
    expect((await tech.post('/api/findings').send({ entity: 'person', entityId: tech.id, severity: 'minor', text: 'Something' })).status).toBe(403);
  });

  it('when the manager of the site answers and closes it, then each step is kept with who and when; another site’s manager and the auditor may not', async () => {
    const f = (await raise({ entity: 'person', entityId: tech.id, text: 'Certificate scan unreadable.' })).body;
    expect((await manager2.post(`/api/findings/${f.id}/answer`).send({ response: 'Not ours.' })).status).toBe(403);
    expect((await auditor.post(`/api/findings/${f.id}/answer`).send({ response: 'Self-answer.' })).status).toBe(403);
    t.clock.advance(3_600_000);
    const answered = await manager.post(`/api/findings/${f.id}/answer`).send({ response: 'New scan requested from the holder.' });
    expect(answered.body).toMatchObject({ status: 'answered', response: 'New scan requested from the holder.', answeredBy: 'Jörg Łukasik' });
    const closed = await manager.post(`/api/findings/${f.id}/close`).send({ note: 'Readable scan checked on 4 March.' });
    expect(closed.body).toMatchObject({ status: 'closed', closingNote: 'Readable scan checked on 4 March.', closedBy: 'Jörg Łukasik' });
    expect((await manager.post(`/api/findings/${f.id}/answer`).send({ response: 'Again.' })).status).toBe(409);
    const trail = (await t.ownerQuery(`select action from audit_log where entity = 'finding' and entity_id = $1 order by id`, [f.id])).rows.map((r) => r.action);
    expect(trail).toEqual(['finding.raised', 'finding.answered', 'finding.closed']);
    await expect(t.ownerQuery(`update findings set status = 'open' where id = $1`, [f.id])).rejects.toThrow(/closed/);
  });

  it('when a finding is about no site in particular, then any manager answers it', async () => {
    const entry = (await t.ownerQuery('select id from audit_log order by id limit 1')).rows[0].id;
    const f = (await raise({ entity: 'audit_entry', entityId: String(entry), severity: 'observation', text: 'Seed entries carry no actor.' })).body;
    expect(f).toMatchObject({ siteId: null, recordLabel: expect.stringMatching(/^Audit trail entry #\d+ \(seed\./) });
    expect((await manager2.post(`/api/findings/${f.id}/answer`).send({ response: 'Expected for demo data.' })).status).toBe(200);
  });

  it('when exported, then the CSV and the register PDF list them, and the CSV export is in the trail', async () => {
    const csv = await asBytes(auditor.get('/api/findings/export.csv').query({ status: 'closed' }));
    const lines = parse((csv.body as Buffer).toString('utf8')) as string[][];
    expect(lines[0].slice(0, 4)).toEqual(['Raised at', 'Raised by', 'Severity', 'Status']);
    expect(lines.slice(1).map((l) => [l[3], l[8], l[12]])).toEqual([['Closed', 'Certificate scan unreadable.', 'Readable scan checked on 4 March.']]);
    const pdf = await asBytes(auditor.get('/api/register/export.pdf'));
    const parser = new PDFParse({ data: new Uint8Array(pdf.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('Major non-conformity · Closed · Person: Kofi Mensah');
    expect(text).toContain('Answer by Jörg Łukasik: New scan requested from the holder.');
    const exported = (await t.ownerQuery(`select new_values from audit_log where action = 'findings.exported'`)).rows;
    expect(exported).toHaveLength(1);
    expect(exported[0].new_values).toMatchObject({ rows: 1, filter: { status: 'closed' } });
  });
});
