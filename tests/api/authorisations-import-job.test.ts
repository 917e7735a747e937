import { describe, it, expect, beforeAll } from 'vitest';
import { makeJobsTestApp, type JobsTestApp } from '../support/jobs.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';
import { makeScope } from '../support/authorisations.js';
import type { ImportJobView } from '../../shared/authorisations/views.js';

let t: JobsTestApp;
let manager: ReturnType<JobsTestApp['agent']>;
let csv: string;
const ROWS = 260;

beforeAll(async () => {
  t = await makeJobsTestApp();
  manager = t.agent();
  await manager.post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD });
  const scope = await makeScope(manager, { title: 'Dead work on mains equipment (paper register)' });
  const rows = Array.from({ length: ROWS }, (_, i) => `paper.${i}@example.test,Paper Person ${i},LEJ-W1,technician,${scope.code},2025-03-01,2026-08-31,Heike Krause,Register p. ${i}`);
  csv = ['email,name,site,roles,scope,issued_on,expires_on,attested_by,note', ...rows].join('\n');
});

const people = async () => Number((await t.ownerQuery(`select count(*) as n from users where email like 'paper.%@example.test'`)).rows[0].n);

describe('a large CSV import as a job', () => {
  it('when the dry run checks a large file, then it answers at once with every row and starts no job', async () => {
    const res = await manager.post('/api/authorisations/import').send({ csv, dryRun: true });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ok: true, dryRun: true, written: null });
    expect(res.body.rows).toHaveLength(ROWS);
    expect(res.body.job).toBeUndefined();
  });

  it('when a manager imports more than 200 rows, then the request answers with a job whose progress they can poll until every row is written', async () => {
    const res = await manager.post('/api/authorisations/import').send({ csv, dryRun: false, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ok: true, dryRun: false, written: null, job: { status: 'queued', total: ROWS, done: 0 } });
    const id = res.body.job.id as string;
    const seen: ImportJobView[] = [];
    const until = Date.now() + 170_000;
    for (;;) {
      const poll = await manager.get(`/api/authorisations/import/jobs/${id}`);
      expect(poll.status).toBe(200);
      seen.push(poll.body);
      if (['done', 'failed'].includes(poll.body.status)) break;
      if (Date.now() > until) throw new Error(`import job still ${poll.body.status} at ${poll.body.done}/${poll.body.total}`);
      await new Promise((r) => setTimeout(r, 100));
    }
    const last = seen[seen.length - 1];
    expect(last).toMatchObject({ status: 'done', total: ROWS, done: ROWS, written: { people: ROWS, authorisations: ROWS }, error: null });
    expect(seen.every((s) => s.done <= s.total && s.total === ROWS)).toBe(true);
    expect(await people()).toBe(ROWS);
  }, 180_000); // 260 people issued and decided in one transaction takes tens of seconds on a busy machine

  it('when someone else asks for that job, then it is not found for them', async () => {
    const id = (await t.ownerQuery('select id from authorisation_import_jobs limit 1')).rows[0].id;
    const other = t.agent();
    await other.post('/api/session').send({ email: DEMO.manager2, password: DEMO_PASSWORD });
    expect((await other.get(`/api/authorisations/import/jobs/${id}`)).status).toBe(404);
  });
});
