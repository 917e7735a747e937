// What npm start keeps alive: the server process (restarted with back-off) and the private cluster.
import type { ChildProcess } from 'node:child_process';

const FIRST_DELAY_MS = 1_000;
const MAX_DELAY_MS = 30_000;
/** A server that ran this long had started fine: its next crash starts the back-off from the beginning. */
export const HEALTHY_RUN_MS = 60_000;

/** 1 s, 2 s, 4 s … capped at 30 s, for the n-th restart in a row (n from 0). */
export function restartDelay(n: number): number {
  return Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** Math.min(n, 30));
}

/**
 * Runs `spawn()` and starts it again whenever it exits on its own. `stop()` ends it (SIGTERM) and
 * resolves once it is gone; no restart follows a stop, also not one already waiting for its delay.
 */
export function superviseProcess(spawn: () => ChildProcess, log: (s: string) => void, name = 'the server') {
  let child: ChildProcess | undefined;
  let restarts = 0;
  let timer: NodeJS.Timeout | undefined;
  let stopping = false;
  let onGone: (() => void) | undefined;

  const run = () => {
    timer = undefined;
    const startedAt = Date.now();
    const proc = spawn();
    child = proc;
    proc.on('exit', (code, signal) => {
      child = undefined;
      if (stopping) return onGone?.();
      if (Date.now() - startedAt >= HEALTHY_RUN_MS) restarts = 0;
      const delay = restartDelay(restarts++);
      log(`${name} stopped (${signal ?? `exit code ${code}`}); starting it again in ${delay / 1000} s`);
      timer = setTimeout(run, delay);
    });
  };
  run();

  return {
    get pid() {
      return child?.pid;
    },
    stop(signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
      stopping = true;
      if (timer) clearTimeout(timer);
      const proc = child;
      if (!proc) return Promise.resolve();
      return new Promise<void>((resolve) => {
        onGone = resolve;
        proc.kill(signal);
      });
    },
  };
}

export interface ClusterControl {
  isRunning: () => boolean;
  start: () => Promise<void>;
}

/**
 * Polls the cluster; when it is found stopped twice in a row (a `pg_ctl restart` in progress gets one
 * poll's time to finish), starts it again. Returns the function that stops watching.
 */
export function watchCluster(cluster: ClusterControl, log: (s: string) => void, everyMs = 2_000): () => void {
  let seenDown = false;
  let busy = false;
  const timer = setInterval(async () => {
    if (busy) return;
    if (cluster.isRunning()) {
      seenDown = false;
      return;
    }
    if (!seenDown) {
      seenDown = true;
      return;
    }
    busy = true;
    log('the database cluster stopped unexpectedly; starting it again');
    try {
      await cluster.start();
      seenDown = false;
      log('the database cluster runs again');
    } catch (err) {
      log(`the database cluster did not start (${(err as Error).message.slice(0, 300)}); trying again`);
    } finally {
      busy = false;
    }
  }, everyMs);
  return () => clearInterval(timer);
}
