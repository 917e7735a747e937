import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { createDraft, nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, tech: Agent, auditor: Agent, admin: Agent;
let published: { id: string; versionId: string; code: string };
let draftOnly: { id: string; versionId: string; code: string };
let withDraft: { id: string; code: string; draftId: string };

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, tech, auditor, admin] = await Promise.all([DEMO.manager, DEMO.manager2, DEMO.technician, DEMO.auditor, DEMO.admin].map((e) => signIn(t, e)));
  published = await publishNew(manager, manager2, { title: 'Proving dead a bench supply', reviewPeriodMonths: 1 }, 'LST-PUB-1');
  draftOnly = await createDraft(manager, { title: 'Draft nobody at the bench may see' }, 'LST-DRAFT-1');
  const p = await publishNew(manager, manager2, { title: 'Commissioning a heater regulator', category: 'commissioning' }, 'LST-PUB-2');
  const v2 = await nextDraft(manager, p.id, () => ({ changeClass: 'editorial', changeSummary: 'Draft of a revision.', title: 'Commissioning a heater regulator (revised draft)' }));
  withDraft = { id: p.id, code: p.code, draftId: v2.id };
});

const list = (a: Agent, query: Record<string, string | number> = {}) => a.get('/api/procedures').query({ q: 'LST-', ...query });

describe('procedures list', () => {
  it('when a technician lists, then only versions in force appear, filtered in the query (totals agree)', async () => {
    const res = await list(tech);
    expect(res.status).toBe(200);
    expect(res.body.items.map((r: { code: string }) => r.code)).toEqual(['LST-PUB-1', 'LST-PUB-2']);
    expect(res.body.total).toBe(2);
    const revised = res.body.items.find((r: { code: string }) => r.code === 'LST-PUB-2');
    expect(revised).toMatchObject({ status: 'published', versionNumber: 1, title: 'Commissioning a heater regulator', myState: 'not-acknowledged' });
    expect((await tech.get(`/api/procedures/${draftOnly.id}`)).status).toBe(404);
    expect((await tech.get(`/api/procedures/${draftOnly.id}/versions/${draftOnly.versionId}`)).status).toBe(404);
    expect((await tech.get(`/api/procedures/${withDraft.id}/versions/${withDraft.draftId}`)).status).toBe(404);
    const history = await tech.get(`/api/procedures/${withDraft.id}`);
    expect(history.body.versions.map((v: { number: number }) => v.number)).toEqual([1]);
    expect(history.body.open).toBeNull();
  });

  it('when a manager or an auditor lists, then drafts are there too, with the newest version and the one in force', async () => {
    for (const reader of [manager, auditor, admin]) {
      const res = await list(reader);
      expect(res.body.items.map((r: { code: string }) => r.code)).toEqual(['LST-DRAFT-1', 'LST-PUB-1', 'LST-PUB-2']);
      const revised = res.body.items.find((r: { code: string }) => r.code === 'LST-PUB-2');
      expect(revised).toMatchObject({ status: 'draft', versionNumber: 2, publishedNumber: 1, title: 'Commissioning a heater regulator (revised draft)', ownerName: 'Jörg Łukasik' });
    }
  });

  it('when filtered, searched, sorted and paged, then the server does it', async () => {
    expect((await list(manager, { status: 'draft' })).body.items.map((r: { code: string }) => r.code)).toEqual(['LST-DRAFT-1', 'LST-PUB-2']);
    expect((await list(manager, { category: 'commissioning' })).body.items.map((r: { code: string }) => r.code)).toEqual(['LST-PUB-2']);
    expect((await manager.get('/api/procedures').query({ q: 'bench supply' })).body.items.map((r: { code: string }) => r.code)).toEqual(['LST-PUB-1']);
    const page2 = await list(manager, { pageSize: 2, page: 2, sort: 'code', dir: 'desc' });
    expect(page2.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(page2.body.items.map((r: { code: string }) => r.code)).toEqual(['LST-DRAFT-1']);
    expect((await manager.get('/api/procedures').query({ status: 'nonsense' })).status).toBe(400);
  });

  it('when a review date passes, then the procedure is listed as overdue and can be filtered by it', async () => {
    const before = (await list(manager)).body.items.find((r: { code: string }) => r.code === 'LST-PUB-1');
    expect(before).toMatchObject({ reviewDueOn: '2026-04-02', reviewOverdue: false });
    t.clock.set('2026-04-03T08:00:00Z');
    try {
      const overdue = await list(tech, { overdue: 'true' });
      expect(overdue.body.items.map((r: { code: string }) => r.code)).toEqual(['LST-PUB-1']);
      expect(overdue.body.items[0].reviewOverdue).toBe(true);
      const one = await manager.get(`/api/procedures/${published.id}`);
      expect(one.body.inForce).toMatchObject({ reviewDueOn: '2026-04-02', reviewOverdue: true });
    } finally {
      t.clock.set('2026-03-02T09:00:00Z');
    }
  });

  it('when a version is superseded, then an auditor still opens it read-only and it says not in force', async () => {
    const p = await publishNew(manager, manager2, {}, 'LST-OLD-1');
    const v2 = await nextDraft(manager, p.id, () => ({ changeClass: 'editorial', changeSummary: 'Title shortened.', title: 'Triac replacement' }));
    await submitAndApprove(manager, manager2, p.id, v2.id);
    const old = await auditor.get(`/api/procedures/${p.id}/versions/${p.versionId}`);
    expect(old.body).toMatchObject({ status: 'superseded', inForce: false, number: 1 });
    expect((await auditor.put(`/api/procedures/${p.id}/versions/${p.versionId}`).send({})).status).toBe(403);
  });
});
