import type { Deps } from '../deps.js';
import { GENESIS, auditKey, sealHmac } from './audit.hash.js';
import { entriesAfter, insertSeals, oldestRunning, sealHead, takeMark, withSealLock, type SealMark } from './seal.repository.js';
import { writeAnchor } from './anchor.js';

export interface SealOptions {
  /** Also record the head outside the database (the scheduled run does). */
  anchor?: boolean;
  /** How long to wait for transactions that already hold entry numbers (ordinary ones take milliseconds). */
  waitMs?: number;
}

export interface SealResult {
  sealed: number;
  head: { id: number; hmac: string } | null;
  /** False while a transaction that may still add entries below the newest number is open. */
  caughtUp: boolean;
}

const BATCH = 500;
const MAX_MARKS = 64;

/**
 * Seals committed entries in id order, after their transactions ended. Numbers come from a sequence and
 * can commit out of order, so a run takes a mark (the newest number, then a new transaction id) and seals
 * up to it only once every transaction older than the mark has ended: no later commit can then fill a
 * hole below it. Marks that are not ready yet are kept, so a long transaction holds back only what follows it.
 */
export function makeSealer(deps: Deps) {
  const { db, clock, config } = deps;
  const key = auditKey(config.audit.key);
  let marks: SealMark[] = [];

  async function readyUpTo(): Promise<number> {
    const xmin = await oldestRunning(db);
    const ready = marks.filter((m) => m.xid <= xmin);
    marks = marks.filter((m) => m.xid > xmin);
    return Math.max(0, ...ready.map((m) => m.hi));
  }

  async function sealBatch(upTo: number): Promise<{ n: number; head: SealResult['head'] }> {
    return withSealLock(db, async (tx) => {
      let prev = (await sealHead(tx)) ?? GENESIS;
      const rows = await entriesAfter(tx, prev.id, upTo, BATCH);
      const sealedAt = clock.now();
      const seals = rows.map((r) => {
        const hmac = sealHmac(key, prev, r);
        const seal = { entryId: r.id, prevId: prev.id, hmac, sealedAt };
        prev = { id: r.id, hmac };
        return seal;
      });
      await insertSeals(tx, seals);
      return { n: seals.length, head: prev.id ? prev : null };
    });
  }

  async function run(opts: SealOptions = {}): Promise<SealResult> {
    const mark = await takeMark(db);
    marks.push(mark);
    // Thinning loses only how soon older entries seal, never correctness: a mark is a promise kept or not.
    if (marks.length > MAX_MARKS) marks = marks.filter((_, i) => i % 2 === 0 || i === marks.length - 1);
    const until = Date.now() + (opts.waitMs ?? 2000);
    let upTo = await readyUpTo();
    let best = upTo;
    while (best < mark.hi && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 25));
      best = Math.max(best, await readyUpTo());
    }
    upTo = best;
    let sealed = 0;
    let head: SealResult['head'] = null;
    for (;;) {
      const b = await sealBatch(upTo);
      sealed += b.n;
      head = b.head;
      if (b.n < BATCH) break;
    }
    if (opts.anchor && head) await writeAnchor(deps, key, head);
    return { sealed, head, caughtUp: upTo >= mark.hi };
  }

  return { run };
}
export type Sealer = ReturnType<typeof makeSealer>;
