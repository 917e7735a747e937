import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { buildRegisterScenario, personWithScan, type RegisterScenario } from '../support/register.js';
import { makePng } from '../fixtures/evidence-files.js';
import { listSites } from '../../server/sites/sites.repository.js';

let t: TestApp;
let s: RegisterScenario;
let auditor: Awaited<ReturnType<typeof signIn>>;
let leipzig: string;

beforeAll(async () => {
  t = await makeTestApp();
  s = await buildRegisterScenario(t, 'Vw');
  auditor = await signIn(t, DEMO.auditor);
  leipzig = (await listSites(t.deps.db)).find((x) => x.code === 'LEJ-W1')!.id;
});

describe('the evidence behind a register row', () => {
  it('when opened at a moment, then it shows the events up to then and what the period was issued on, read-only', async () => {
    const before = await auditor.get(`/api/register/${s.ids.d}/evidence`).query({ at: '2026-03-11T12:00:00Z' });
    expect(before.status).toBe(200);
    expect(before.body.row).toMatchObject({ state: 'active', person: { id: s.people.d.id } });
    expect(before.body.events.map((e: { kind: string }) => e.kind)).toEqual(['issued']);
    const after = await auditor.get(`/api/register/${s.ids.d}/evidence`).query({ at: '2026-03-16T12:00:00Z' });
    expect(after.body.row.state).toBe('revoked');
    expect(after.body.events.map((e: { kind: string; signedBy: string | null }) => [e.kind, e.signedBy])).toEqual([['issued', null], ['revoked', 'Jörg Łukasik']]);
    expect(after.body.basis).toEqual([expect.objectContaining({ kind: 'certificate', met: true, evidence: [expect.objectContaining({ type: 'certificate', files: [] })] })]);
    const paper = await auditor.get(`/api/register/${s.ids.f}/evidence`).query({ at: '2026-03-27T12:00:00Z' });
    expect(paper.body.paperRecord).toMatchObject({ attestedBy: 'H. Brandt, former workshop lead', issuedOn: '2026-01-10', expiresOn: '2026-12-31' });
  });

  it('when the certificate it rests on came with a scan, then the scan is listed and can be opened read-only', async () => {
    const png = makePng(8, 6);
    t.clock.set('2026-06-05T12:00:00Z');
    const g = await personWithScan(t, s.manager, s.scope.id, png);
    t.clock.set('2026-06-05T13:00:00Z');
    const res = await auditor.get(`/api/register/${g.authorisationId}/evidence`);
    const file = res.body.basis[0].evidence[0].files[0];
    expect(file).toMatchObject({ id: g.fileId, fileName: 'first-aid-card.png', mediaType: 'image/png', sizeBytes: png.length });
    const content = await auditor.get(`/api/evidence/${file.id}/content`);
    expect(content.status).toBe(200);
    expect(content.headers['content-type']).toBe('image/png');
  });

  it('when there is no period at that moment or no such authorisation, then 404; a technician is refused', async () => {
    expect((await auditor.get(`/api/register/${s.ids.e}/evidence`).query({ at: '2026-03-11T12:00:00Z' })).status).toBe(404);
    expect((await auditor.get('/api/register/00000000-0000-4000-8000-000000000000/evidence')).status).toBe(404);
    expect((await s.people.a.get(`/api/register/${s.ids.a}/evidence`)).status).toBe(403);
  });
});

describe('the matrix', () => {
  it('when read for a site at a past moment, then each person is a row and each cell the state and expiry then', async () => {
    const res = await auditor.get('/api/matrix').query({ siteId: leipzig, at: '2026-03-16T12:00:00Z', q: 'Vw ' });
    expect(res.status).toBe(200);
    expect(res.body.scopes.map((x: { id: string }) => x.id)).toContain(s.scope.id);
    const cell = (l: 'a' | 'b' | 'd' | 'e' | 'f') => res.body.people.find((p: { id: string }) => p.id === s.people[l].id)?.cells[s.scope.id];
    expect(res.body.total).toBe(6);
    expect(cell('a')).toMatchObject({ state: 'active', validUntil: '2026-06-02', authorisationId: s.ids.a });
    expect(cell('d')).toMatchObject({ state: 'revoked', validUntil: '2026-03-15' });
    expect(cell('f')).toMatchObject({ state: 'active', validUntil: '2026-12-31' });
    expect(cell('e'), 'E was not yet issued').toBeUndefined();
    const live = await auditor.get('/api/matrix').query({ siteId: leipzig, liveWork: 'false', q: 'Vw ' });
    expect(live.body.scopes.every((x: { allowsLiveWork: boolean }) => !x.allowsLiveWork)).toBe(true);
    expect(live.body.people.every((p: { cells: object }) => Object.keys(p.cells).length === 0)).toBe(true);
  });

  it('when a manager of the other site reads it, then none of these people are on it', async () => {
    const other = await signIn(t, DEMO.manager2);
    const res = await other.get('/api/matrix').query({ q: 'Vw ' });
    expect(res.body).toMatchObject({ people: [], total: 0 });
  });
});

describe('the overview', () => {
  it('when read now, then counts by site, scope and state, the expiry windows, the soonest and the weekly chart agree', async () => {
    t.clock.set('2026-06-05T13:00:00Z');
    const res = await auditor.get('/api/overview').query({ siteId: leipzig });
    expect(res.status).toBe(200);
    const mine = res.body.counts.filter((c: { scopeId: string }) => c.scopeId === s.scope.id);
    // Counted row by row from the register itself: the scenario's six, the scan holder, and anyone the demo data gave the scope to.
    const listed = (await auditor.get('/api/register').query({ scopeId: s.scope.id, siteId: leipzig, pageSize: 200 })).body.items as { state: string }[];
    const byState: Record<string, number> = {};
    for (const r of listed) byState[r.state] = (byState[r.state] ?? 0) + 1;
    expect(Object.fromEntries(mine.map((c: { state: string; n: number }) => [c.state, c.n]))).toEqual(byState);
    expect(byState).toMatchObject({ lapsed: 3, revoked: 1 });
    const ends = (await auditor.get('/api/register').query({ siteId: leipzig, pageSize: 200 })).body.items
      .filter((r: { state: string }) => ['active', 'suspended', 'renewal_submitted'].includes(r.state))
      .map((r: { endsAt: string }) => (Date.parse(r.endsAt) - Date.parse('2026-06-05T13:00:00Z')) / 86_400_000);
    expect(res.body.expiring).toEqual([30, 60, 90].map((days) => ({ days, n: ends.filter((d: number) => d <= days).length })));
    expect(res.body.weeks).toHaveLength(13);
    expect(res.body.weeks.reduce((n: number, w: { n: number }) => n + w.n, 0)).toBe(ends.filter((d: number) => d < 91).length);
    expect(res.body.soonest[0].person.id).toBe(s.people.e.id);
  });

  it('when a technician asks, then it is refused', async () => {
    expect((await s.people.a.get('/api/overview')).status).toBe(403);
  });
});
