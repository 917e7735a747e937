import { createHash } from 'node:crypto';
import { describe, it, expect, beforeAll } from 'vitest';
import { sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { asBytes } from '../support/download.js';
import { HTML_PAGE, INSTRUMENT_CSV, makePdf, makePng } from '../fixtures/evidence-files.js';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let tech: Agent;
let tech2: Agent;
let assessor: Agent;
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const stored = async () => Number((await t.ownerQuery('select count(*) from evidence')).rows[0].count);
const upload = (agent: Agent, file: Buffer, filename: string, fields: Record<string, string> = {}) => {
  const req = agent.post('/api/evidence');
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  // The client's content type is a lie on purpose in some tests: the server must not believe it.
  return req.attach('file', file, { filename, contentType: 'image/png' });
};

beforeAll(async () => {
  t = await makeTestApp();
  [tech, tech2, assessor] = await Promise.all([signIn(t, DEMO.technician), signIn(t, DEMO.technician2), signIn(t, DEMO.assessor)]);
});

describe('evidence upload', () => {
  it('when a technician uploads a PNG, then it comes back byte-identical, with its SHA-256, shown inline', async () => {
    const png = makePng(6, 4);
    const res = await upload(tech, png, 'scope capture.png', { caption: 'Gate trigger at 90°' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ mediaType: 'image/png', sizeBytes: png.length, sha256: sha256(png), fileName: 'scope capture.png', ownerId: tech.user.id, entity: 'person', entityId: tech.user.id, caption: 'Gate trigger at 90°' });
    const down = await asBytes(tech.get(`/api/evidence/${res.body.id}/content`));
    expect(down.status).toBe(200);
    expect(Buffer.compare(down.body, png)).toBe(0);
    expect(sha256(down.body)).toBe(res.body.sha256);
    expect(down.headers['content-type']).toBe('image/png');
    expect(down.headers['content-disposition']).toMatch(/^inline; filename="scope capture.png"/);
    expect(down.headers['x-content-type-options']).toBe('nosniff');
    expect(down.headers['content-security-policy']).toMatch(/^default-src 'none'/);
    const audited = await t.ownerQuery("select new_values from audit_log where action = 'evidence.uploaded' and entity_id = $1", [res.body.id]);
    expect(audited.rows[0].new_values).toMatchObject({ sha256: sha256(png), uploaderId: tech.user.id });
  });

  it('when a file named .png is really HTML, then 422 names file and nothing is stored', async () => {
    const before = await stored();
    const res = await upload(tech, HTML_PAGE, 'photo.png');
    expect(res.status).toBe(422);
    expect(res.body.error.fields.file).toBe('the content is HTML or XML markup, not a CSV export');
    expect(await stored()).toBe(before);
  });

  it('when a PNG is named .pdf, then the name is refused rather than trusted', async () => {
    const res = await upload(tech, makePng(), 'report.pdf');
    expect(res.status).toBe(422);
    expect(res.body.error.fields.file).toBe('the name ends in .pdf but the content is a PNG image');
  });

  it('when a PDF and a CSV export are uploaded, then each downloads as an attachment of its own type, never sniffed', async () => {
    const pdf = await makePdf();
    const p = await upload(tech, pdf, 'Prüfprotokoll Łódź.pdf');
    expect(p.status).toBe(201);
    const pd = await asBytes(tech.get(`/api/evidence/${p.body.id}/content`));
    expect(pd.headers['content-type']).toBe('application/pdf');
    expect(pd.headers['content-disposition']).toBe(`attachment; filename="Pr_fprotokoll __d_.pdf"; filename*=UTF-8''${encodeURIComponent('Prüfprotokoll Łódź.pdf')}`);
    expect(pd.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(pd.body, pdf)).toBe(0);
    const c = await upload(tech, INSTRUMENT_CSV, 'rcd-trip-log.csv');
    expect(c.body.mediaType).toBe('text/csv');
    const cd = await asBytes(tech.get(`/api/evidence/${c.body.id}/content`));
    expect(cd.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(cd.headers['content-disposition']).toMatch(/^attachment; filename="rcd-trip-log.csv"/);
    expect(cd.headers['content-security-policy']).toMatch(/^default-src 'none'/);
    const csvPreview = await asBytes(tech.get(`/api/evidence/${c.body.id}/content`).query({ preview: '1' }));
    expect(csvPreview.headers['content-disposition'], 'only PDFs open as a preview').toMatch(/^attachment/);
  });

  it('when a PDF is asked for as a preview, then it opens inline, framed only by our own pages, never sniffed', async () => {
    const p = await upload(tech, await makePdf(), 'insulation test.pdf');
    const res = await asBytes(tech.get(`/api/evidence/${p.body.id}/content`).query({ preview: '1' }));
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^inline; filename="insulation test.pdf"/);
    expect(res.headers['content-security-policy']).toBe("default-src 'none'; frame-ancestors 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });

  it('when a CSV is not CSV (binary bytes, or rows that do not parse), then it is refused naming file', async () => {
    const before = await stored();
    const binary = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00, 0x61, 0x2c, 0x62, 0x0a]);
    const b = await upload(tech, binary, 'export.csv');
    expect(b.status).toBe(422);
    expect(b.body.error.fields.file).toBe('the content is not a JPEG or PNG image, a PDF or a CSV export');
    const ragged = await upload(tech, Buffer.from('time,value\n1,"229.8\n2,230.1,V\n'), 'export.csv');
    expect(ragged.status).toBe(422);
    expect(ragged.body.error.fields.file).toMatch(/does not parse as a CSV export/);
    expect(await stored()).toBe(before);
  });

  it('when a name carries a path, then only the last part is kept', async () => {
    const res = await upload(tech, makePng(), '../../etc/<b>cal</b>.png');
    expect(res.status).toBe(201);
    expect(res.body.fileName).toBe('b_.png');
  });

  it('when no file is sent, or an unknown field, then the request is refused naming the field', async () => {
    const none = await tech.post('/api/evidence').field('caption', 'nothing attached');
    expect(none.status).toBe(422);
    expect(none.body.error.fields).toEqual({ file: 'attach a file' });
    const unknown = await upload(tech, makePng(), 'a.png', { colour: 'amber' });
    expect(unknown.status).toBe(400);
    const other = await tech.post('/api/evidence').attach('photo', makePng(), 'a.png');
    expect(other.status).toBe(400);
    expect(other.body.error.fields).toHaveProperty('file');
  });
});

describe('who may attach and see evidence', () => {
  let techFile: string;
  beforeAll(async () => {
    techFile = (await upload(tech, makePng(2, 2), 'mine.png')).body.id;
  });

  it("when a technician asks for another technician's evidence, then 403 for the file and its metadata, and it is not in their list", async () => {
    expect((await tech2.get(`/api/evidence/${techFile}/content`)).status).toBe(403);
    expect((await tech2.get(`/api/evidence/${techFile}`)).status).toBe(403);
    const list = await tech2.get('/api/evidence').query({ ownerId: tech.user.id });
    expect(list.body.total).toBe(0);
  });

  it('when an assessor covering the site, an auditor or an admin asks, then they get it; a manager of another site does not', async () => {
    expect((await assessor.get(`/api/evidence/${techFile}/content`)).status).toBe(200);
    expect((await (await signIn(t, DEMO.auditor)).get(`/api/evidence/${techFile}/content`)).status).toBe(200);
    expect((await (await signIn(t, DEMO.admin)).get(`/api/evidence/${techFile}`)).status).toBe(200);
    expect((await (await signIn(t, DEMO.manager2)).get(`/api/evidence/${techFile}/content`)).status).toBe(403);
  });

  it("when a technician attaches to someone else's record, then 403; an assessor covering that site may", async () => {
    expect((await upload(tech, makePng(), 'x.png', { ownerId: tech2.user.id })).status).toBe(403);
    const res = await upload(assessor, makePng(), 'witnessed.png', { ownerId: tech.user.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ ownerId: tech.user.id, uploaderId: assessor.user.id, uploaderName: 'Priya Natarajan' });
    const list = await tech.get('/api/evidence').query({ ownerId: tech.user.id, pageSize: 200 });
    expect(list.body.items.map((e: { id: string }) => e.id)).toContain(res.body.id);
  });

  it("when evidence is linked to a pre-use check, then it must be the owner's own check", async () => {
    const benches = (await tech.get('/api/benches').query({ q: 'LEJ-B1' })).body.items;
    const check = await tech.post(`/api/benches/${benches[0].id}/pre-use-checks`).send({ passed: true, password: DEMO_PASSWORD });
    const mine = await upload(tech, makePng(), 'rcd-test.png', { entity: 'bench_check', entityId: check.body.id });
    expect(mine.status).toBe(201);
    const listed = await tech.get('/api/evidence').query({ entity: 'bench_check', entityId: check.body.id });
    expect(listed.body.items.map((e: { id: string }) => e.id)).toEqual([mine.body.id]);
    const theirs = await upload(tech2, makePng(), 'rcd-test.png', { entity: 'bench_check', entityId: check.body.id });
    expect(theirs.status).toBe(422);
    expect(theirs.body.error.fields.entityId).toBe('that pre-use check was recorded by someone else');
  });

  it('when the application tries to change stored evidence, then the database refuses', async () => {
    await expect(t.deps.db.execute(sql`update evidence set caption = 'changed'`)).rejects.toThrow();
    await expect(t.deps.db.execute(sql`delete from evidence`)).rejects.toThrow();
  });
});
