import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { makePng } from '../fixtures/evidence-files.js';

let t: TestApp;
let seeded = 0;
beforeAll(async () => {
  t = await makeTestApp({ env: { UPLOAD_MAX_BYTES: '1000' } });
  seeded = await count();
});

// Counted from what the demo seed stored (its practicals carry evidence of their own).
const count = async () => Number((await t.ownerQuery('select count(*) from evidence')).rows[0].count);
const stored = async () => (await count()) - seeded;

describe('upload size limit (UPLOAD_MAX_BYTES=1000)', () => {
  it('when a file is larger than the limit, then 413 names file and nothing is stored', async () => {
    const tech = await signIn(t, DEMO.technician);
    const big = makePng(40, 40, true);
    expect(big.length).toBeGreaterThan(1000);
    const res = await tech.post('/api/evidence').attach('file', big, 'oscillogram.png');
    expect(res.status).toBe(413);
    expect(res.body.error.fields).toHaveProperty('file');
    expect(await stored()).toBe(0);
  });

  it('when a file is exactly at the limit, then it is accepted', async () => {
    const tech = await signIn(t, DEMO.technician);
    const padded = Buffer.from(`time;reading\n1;${'2'.repeat(1000 - 15)}`);
    expect(padded.length).toBe(1000);
    const res = await tech.post('/api/evidence').attach('file', padded, 'log.csv');
    expect(res.status).toBe(201);
    expect(await stored()).toBe(1);
  });
});
