import PgBoss from 'pg-boss';
import type { Deps } from '../deps.js';
import type { Reminders, SweepResult } from '../reminders/reminders.service.js';
import { AppError } from '../errors.js';
import { QUEUES, QUEUE_OPTIONS, SWEEP_CRON } from './queues.js';
import { JOBS_SCHEMA } from './install.js';
import { POOL_BOUNDS } from '../db/client.js';
import { isDatabaseUnavailable, outageReporter } from '../db/outage.js';

export interface JobsOptions {
  /** How often an idle worker looks for work (pg-boss allows 0.5 s at least). */
  pollSeconds?: number;
  /** Install the cron schedule for the sweep (tests that drive the sweep themselves leave it off). */
  schedule?: boolean;
}

/**
 * One pg-boss per app process, on the application's own login (DATABASE_URL) and its own schema, which
 * the migrations set up (installJobQueues): here it only checks it. Workers receive arrays of jobs.
 * Nothing runs until start(); stop() drains and closes.
 */
/** `alongside` runs with every sweep: other once-only reminder work (procedure reviews due). */
/** A feature's own worker on this process's queue; what it returns undoes its hooks when the queue stops. */
export type QueueWorker = (b: PgBoss, work: PgBoss.WorkOptions) => Promise<() => void>;

/** `workers`: the audit sealer (server/jobs/seal.ts), large imports. */
export function makeJobs(deps: Deps, reminders: Reminders, alongside: (() => Promise<unknown>)[] = [], workers: QueueWorker[] = []) {
  const detach: (() => void)[] = [];
  let boss: PgBoss | null = null;
  let starting: Promise<void> | null = null;
  let scheduled = false;

  async function afterSweep(result: SweepResult) {
    if (!boss || !result.nextAttemptAt) return;
    const seconds = Math.max(1, Math.ceil((new Date(result.nextAttemptAt).getTime() - deps.clock.now().getTime()) / 1000));
    await boss.sendAfter(QUEUES.deliver, {}, { singletonKey: 'retry' }, seconds);
  }

  async function boot(opts: JobsOptions) {
    const b = new PgBoss({ ...POOL_BOUNDS, connectionString: deps.config.databaseUrl, schema: JOBS_SCHEMA, max: 4, application_name: 'breakover-jobs', migrate: false, schedule: opts.schedule !== false });
    // Every worker's poll fails while the database is away: one warning per outage; pg-boss retries by itself.
    const outage = outageReporter(deps.log, 'job queue');
    b.on('error', (err) => (isDatabaseUnavailable(err) ? outage.lost(err) : deps.log.error({ err }, `job queue: ${err.message}`)));
    await b.start().catch((err: Error) => {
      throw new Error(`the job queue could not start (${err.message}); the migrations, run as the database owner, set it up`);
    });
    for (const q of QUEUE_OPTIONS) {
      if (!(await b.getQueue(q.name))) throw new Error(`the job queue ${q.name} is missing: run the migrations as the database owner`);
    }
    if (opts.schedule !== false) await b.schedule(QUEUES.sweep, SWEEP_CRON, { scheduled: true }, { tz: 'UTC' });
    const work = { batchSize: 1, pollingIntervalSeconds: opts.pollSeconds ?? 2 };
    await b.work(QUEUES.sweep, work, async (jobs) => {
      const out: (SweepResult & { pid: number })[] = [];
      for (const _job of jobs) {
        out.push({ ...(await reminders.sweep()), pid: process.pid });
        for (const task of alongside) await task();
        await deps.mailer.deliver();
      }
      await afterSweep(out[out.length - 1]);
      return out.length === 1 ? out[0] : out;
    });
    await b.work(QUEUES.deliver, work, async (jobs) => {
      const out: object[] = [];
      for (const _job of jobs) {
        const delivered = await reminders.deliver();
        out.push({ ...delivered, pid: process.pid });
      }
      return out[0];
    });
    await b.work(QUEUES.mail, work, async () => ({ ...(await deps.mailer.deliver()), pid: process.pid }));
    deps.mailer.useQueue((after) => (after ? b.sendAfter(QUEUES.mail, {}, { singletonKey: 'later' }, after) : b.send(QUEUES.mail, {}, { singletonKey: 'now' })));
    for (const w of workers) detach.push(await w(b, work));
    boss = b;
    scheduled = opts.schedule !== false;
  }

  return {
    start(opts: JobsOptions = {}): Promise<void> {
      starting ??= boot(opts);
      return starting;
    },
    async stop() {
      await starting?.catch(() => undefined);
      const b = boss;
      boss = null;
      for (const undo of detach.splice(0)) undo();
      if (b) deps.mailer.useQueue(null);
      starting = null;
      if (b) await b.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
    get running() {
      return boss !== null;
    },
    /** Whether this process runs the sweep on its schedule (callers that drive sweeps themselves turn it off). */
    get scheduled() {
      return boss !== null && scheduled;
    },
    /** Asks for a sweep now; any process's worker may take it. */
    async requestSweep(requestedBy: string | null): Promise<string> {
      if (!boss) throw new AppError(503, 'jobs_not_running', 'The job queue is not running in this server process; the scheduled sweep runs where it is.');
      const id = await boss.send(QUEUES.sweep, { requestedBy });
      if (!id) throw new AppError(503, 'jobs_not_running', 'The job queue did not take the request.');
      return id;
    },
    async job(id: string) {
      if (!boss) throw new AppError(503, 'jobs_not_running', 'The job queue is not running in this server process.');
      return boss.getJobById(QUEUES.sweep, id, { includeArchive: true });
    },
    /** The queue's own database connection, for tests that look at finished jobs. */
    get boss() {
      return boss;
    },
  };
}
export type Jobs = ReturnType<typeof makeJobs>;
