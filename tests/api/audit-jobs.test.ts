import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it, expect, beforeAll } from 'vitest';
import { makeJobsTestApp, type JobsTestApp } from '../support/jobs.js';
import { ANCHOR_FILE } from '../../server/audit/anchor.js';

let t: JobsTestApp;
beforeAll(async () => {
  t = await makeJobsTestApp();
});

const unsealed = async () => Number((await t.ownerQuery('select count(*) as n from audit_log l where not exists (select 1 from audit_seal s where s.entry_id = l.id)')).rows[0].n);

/** Polls (no fixed sleep) until the check holds; fails after `ms`. */
async function eventually(check: () => Promise<boolean>, ms = 30_000) {
  const until = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`not so after ${ms} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('sealing on the job queue', () => {
  it('when entries are written where the queue runs, then a seal run follows by itself and seals them all', async () => {
    await t.deps.db.transaction((tx) => t.deps.audit(tx, { actorId: null, action: 'test.queued', entity: 'test', entityId: 'q' }));
    await eventually(async () => (await unsealed()) === 0);
    const sealedOurs = await t.ownerQuery(`select 1 from audit_seal s join audit_log l on l.id = s.entry_id where l.action = 'test.queued'`);
    expect(sealedOurs.rowCount).toBe(1);
  });

  it('when the sweep runs, then the head is anchored in the anchor file', async () => {
    const file = path.join(t.config.audit.anchorDir, ANCHOR_FILE);
    expect(existsSync(file)).toBe(false);
    await t.waitForJobs([await t.jobs.requestSweep(null)]);
    const [, id, hmac] = readFileSync(file, 'utf8').trim().split('\n')[0].split('\t');
    // Later entries (mail delivery, say) may be sealed since; the anchored one is sealed as the line says.
    const sealed = (await t.ownerQuery('select hmac from audit_seal where entry_id = $1', [Number(id)])).rows;
    expect(sealed).toEqual([{ hmac }]);
    expect(Number(id)).toBeGreaterThanOrEqual(Number((await t.ownerQuery(`select max(id) as m from audit_log where action = 'test.queued'`)).rows[0].m));
  });
});
