import type PgBoss from 'pg-boss';
import type { Deps } from '../deps.js';
import type { Sealer } from '../audit/sealer.js';
import { QUEUES } from './queues.js';

/** Seconds between an append and the seal run it asks for: appends close together share one run. */
const AFTER_APPEND_SECONDS = 1;
/** While a transaction that holds entry numbers is open, look again this often. */
const RETRY_SECONDS = 5;

/**
 * The seal worker on this process's queue, and the request after appends. The queue keeps at most one
 * run waiting (policy 'stately'), and the sealer's advisory lock lets one seal at a time across processes.
 */
export async function workSeal(b: PgBoss, { audit, log }: Deps, sealer: Sealer, work: PgBoss.WorkOptions): Promise<() => void> {
  await b.work(QUEUES.seal, work, async () => {
    const result = await sealer.run();
    if (!result.caughtUp) await b.sendAfter(QUEUES.seal, {}, {}, RETRY_SECONDS);
    return { ...result, pid: process.pid };
  });
  // Whatever was written while no queue ran here (the seed, a restart) is sealed without waiting for a write.
  await b.send(QUEUES.seal, {});
  let waiting = false;
  let stopped = false;
  audit.onAppended = () => {
    if (waiting) return;
    waiting = true;
    setTimeout(() => {
      waiting = false;
      if (!stopped) b.sendAfter(QUEUES.seal, {}, {}, AFTER_APPEND_SECONDS).catch((err: Error) => log.error({ err }, `audit: could not ask for a seal run: ${err.message}`));
    }, 100).unref();
  };
  return () => {
    stopped = true;
    audit.onAppended = null;
  };
}
