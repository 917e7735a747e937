import type PgBoss from 'pg-boss';
import type { Deps } from '../deps.js';
import { defineAbilityFor, type Actor } from '../../shared/abilities.js';
import type { ImportJobView } from '../../shared/authorisations/views.js';
import { notFound } from '../errors.js';
import { QUEUES } from '../jobs/queues.js';
import type { ImportService } from './import.service.js';
import type { Signer } from './import.write.js';
import { importJob, insertImportJob, updateImportJob, type ImportJobRow } from './import-jobs.repository.js';

/** Progress is written every this many rows: often enough to watch, rarely enough to cost nothing. */
const PROGRESS_EVERY = 25;

const present = (j: ImportJobRow): ImportJobView => ({
  id: j.id, status: j.status as ImportJobView['status'], total: j.total, done: j.done,
  written: (j.written as ImportJobView['written']) ?? null, error: j.error, createdAt: j.createdAt.toISOString(), finishedAt: j.finishedAt?.toISOString() ?? null,
});

type LoadActor = (userId: string) => Promise<{ actor: Actor } | null>;

/**
 * Large CSV imports as jobs: the request checks, signs and records the job; a worker on the queue (or,
 * where this process runs no queue, this process after answering) checks again as the person who asked
 * and writes every row in one transaction, reporting progress as it goes.
 */
export function makeImportJobs(deps: Deps, importer: ImportService, loadActor: LoadActor) {
  const { db, clock } = deps;
  let send: ((jobId: string) => Promise<unknown>) | null = null;

  async function run(id: string): Promise<ImportJobView> {
    const job = await importJob(db, id);
    if (!job) throw notFound('The import job');
    if (job.status !== 'queued') return present(job);
    await updateImportJob(db, id, { status: 'running', startedAt: clock.now() });
    try {
      const loaded = await loadActor(job.actorId);
      if (!loaded) throw new Error('the person who started the import can no longer sign in');
      const planned = await importer.checked(loaded.actor, defineAbilityFor(loaded.actor), job.csv);
      let done = 0;
      let reported = Promise.resolve();
      const written = await importer.write(loaded.actor, planned, { signerId: job.actorId, printedName: job.printedName }, () => {
        if (++done % PROGRESS_EVERY === 0) reported = reported.then(() => updateImportJob(db, id, { done }));
      });
      await reported;
      await updateImportJob(db, id, { status: 'done', done: planned.length, written, finishedAt: clock.now() });
    } catch (err) {
      await updateImportJob(db, id, { status: 'failed', error: (err as Error).message.slice(0, 2000), finishedAt: clock.now() });
    }
    return present((await importJob(db, id))!);
  }

  async function start(actor: Actor, signer: Signer, csv: string, total: number): Promise<ImportJobView> {
    const job = await insertImportJob(db, { actorId: actor.id, printedName: signer.printedName, csv, status: 'queued', total, createdAt: clock.now() });
    if (send) await send(job.id);
    else void run(job.id).catch((err: Error) => deps.log.error({ err }, `import job ${job.id}: ${err.message}`));
    return present(job);
  }

  async function status(actor: Actor, id: string): Promise<ImportJobView> {
    const job = await importJob(db, id, actor.id);
    if (!job) throw notFound('The import job');
    return present(job);
  }

  /** The queue's worker, and this process's way to hand a job to it. */
  async function work(b: PgBoss, opts: PgBoss.WorkOptions) {
    await b.work<{ jobId: string }>(QUEUES.import, opts, async ([job]) => run(job.data.jobId));
    send = (jobId) => b.send(QUEUES.import, { jobId });
    return () => {
      send = null;
    };
  }

  importer.useBackground(start);
  return { run, start, status, work };
}
export type ImportJobs = ReturnType<typeof makeImportJobs>;
