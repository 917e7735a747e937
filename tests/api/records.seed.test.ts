import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});

describe('the demo sign-offs and practicals', () => {
  it('when the demo is seeded, then one sign-off waits for a countersignature and one is countersigned', async () => {
    const assessor = await signIn(t, DEMO.assessor);
    const waiting = (await assessor.get('/api/signoffs').query({ awaitingMe: 'true' })).body.items;
    expect(waiting.map((r: { personName: string; status: string }) => [r.personName, r.status])).toEqual([['Amélie Fournier', 'submitted']]);
    const tech = await signIn(t, DEMO.technician);
    const mine = (await tech.get('/api/signoffs')).body.items;
    expect(mine.map((r: { status: string; done: number; total: number }) => [r.status, r.done, r.total])).toEqual([['countersigned', 2, 2]]);
    const s = (await tech.get(`/api/signoffs/${mine[0].id}`)).body;
    expect(s.signatures.map((x: { printedName: string; meaning: string }) => [x.printedName, x.meaning])).toEqual([['Tomasz Wójcik', 'completed as recorded'], ['Priya Natarajan', 'countersigned']]);
  });

  it('when the demo practicals are read, then the competent one passes every reading and the other fails one, against the engine’s expected values', async () => {
    const manager = await signIn(t, DEMO.manager);
    const rows = (await manager.get('/api/practicals').query({ view: 'site' })).body.items;
    expect(rows.map((r: { outcome: string; failed: number; benchCode: string }) => [r.outcome, r.failed, r.benchCode]).sort()).toEqual([['competent', 0, 'LEJ-B1'], ['not_yet_competent', 1, 'LEJ-B1']]);
    for (const row of rows) {
      const p = (await manager.get(`/api/practicals/${row.id}`)).body;
      expect(p).toMatchObject({ status: 'acknowledged', progress: { done: row.outcome === 'competent' ? 7 : 6, total: 7 } });
      expect(p.holdPoints.every((h: { witnessed: unknown }) => h.witnessed)).toBe(true);
      const volts = p.items.find((i: { prompt: string }) => i.prompt.startsWith('Output RMS voltage'));
      // 200 W at 230 V is 264.5 Ω; the stored expectation is the engine's at the simulated firing angle.
      expect(p.expectations.load.resistanceOhms).toBeCloseTo(264.5, 9);
      expect(volts.entry.expected).toBe(p.expectations.quantities['output-rms-voltage']);
      expect(volts.entry.verdict).toBe(row.outcome === 'competent' ? 'pass' : 'fail');
      const evidence = (await manager.get('/api/evidence').query({ entity: 'practical', entityId: p.id })).body.items;
      expect(evidence.map((e: { mediaType: string }) => e.mediaType)).toEqual(['image/png']);
    }
  });
});
