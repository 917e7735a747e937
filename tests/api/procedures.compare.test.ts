import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, tech: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, tech] = await Promise.all([DEMO.manager, DEMO.manager2, DEMO.technician].map((e) => signIn(t, e)));
});

const section = (body: { sections: { title: string }[] }, title: string) => body.sections.find((s) => s.title === title) as any;

describe('comparing two versions', () => {
  it('when step 3 is reworded, a hazard added and a PPE line removed, then the side-by-side rows mark exactly that', async () => {
    const p = await publishNew(manager, manager2);
    const v2 = await nextDraft(manager, p.id, (v) => ({
      changeClass: 're-read', changeSummary: 'Rating of the replacement named; insulated gloves no longer optional.',
      hazards: [...v.hazards, 'Hot soldering iron tip'],
      ppe: [],
      steps: v.steps.map((s: { text: string }, i: number) => (i === 2 ? { ...s, text: 'Desolder the triac and fit a replacement rated 600 V or more.' } : s)),
    }));
    await submitAndApprove(manager, manager2, p.id, v2.id);
    const res = await tech.get(`/api/procedures/${p.id}/compare`).query({ from: p.versionId, to: v2.id });
    // The technician sees v2 only, so the old one is not theirs to compare.
    expect(res.status).toBe(404);
    const cmp = await manager.get(`/api/procedures/${p.id}/compare`).query({ from: v2.id, to: p.versionId });
    expect(cmp.status).toBe(200);
    expect(cmp.body.from).toMatchObject({ number: 1, status: 'superseded' });
    expect(cmp.body.to).toMatchObject({ number: 2, status: 'published' });
    expect(section(cmp.body, 'Scope')).toMatchObject({ changed: false });
    expect(section(cmp.body, 'Hazards').rows).toEqual([
      { kind: 'same', left: [{ text: 'Stored charge in the suppression capacitor' }], right: [{ text: 'Stored charge in the suppression capacitor' }] },
      { kind: 'same', left: [{ text: 'Mains voltage if the unit is plugged in by mistake' }], right: [{ text: 'Mains voltage if the unit is plugged in by mistake' }] },
      { kind: 'added', left: null, right: [{ text: 'Hot soldering iron tip', mark: 'added' }] },
    ]);
    expect(section(cmp.body, 'Personal protective equipment').rows).toEqual([
      { kind: 'removed', left: [{ text: 'Safety glasses when desoldering', mark: 'removed' }], right: null },
    ]);
    const changed = section(cmp.body, 'Steps').rows.filter((r: { kind: string }) => r.kind !== 'same');
    expect(changed).toEqual([
      {
        kind: 'changed',
        // Word by word: the shared words stay unmarked on both sides.
        left: [
          { text: '3. Desolder the triac and fit ' }, { text: 'the', mark: 'removed' }, { text: ' replacement ' }, { text: 'of the same', mark: 'removed' },
          { text: ' or ' }, { text: 'higher rating', mark: 'removed' }, { text: '.' },
        ],
        right: [
          { text: '3. Desolder the triac and fit ' }, { text: 'a', mark: 'added' }, { text: ' replacement ' }, { text: 'rated 600 V', mark: 'added' },
          { text: ' or ' }, { text: 'more', mark: 'added' }, { text: '.' },
        ],
      },
    ]);
  });

  it('when the same version is given twice or a version of another procedure, then 400 or 404', async () => {
    const a = await publishNew(manager, manager2);
    const b = await publishNew(manager, manager2);
    expect((await manager.get(`/api/procedures/${a.id}/compare`).query({ from: a.versionId, to: a.versionId })).status).toBe(400);
    expect((await manager.get(`/api/procedures/${a.id}/compare`).query({ from: a.versionId, to: b.versionId })).status).toBe(404);
    expect((await manager.get(`/api/procedures/${a.id}/compare`).query({ from: a.versionId })).status).toBe(400);
  });
});
