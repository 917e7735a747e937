import type { Executor } from '../db/client.js';
import type { Anchor } from './anchor.js';
import { makeWalk, type ChainIssue } from './verify.walk.js';
import { anchoredSeals, orphanSeals, walkBatch } from './verify.repository.js';

export interface ChainReport {
  intact: boolean;
  entries: number;
  sealed: number;
  unsealed: number;
  head: { id: number; position: number; hmac: string } | null;
  lastAnchor: Anchor | null;
  anchors: number;
  issues: ChainIssue[];
  issueCount: number;
}

const MAX_LISTED = 50;

/**
 * Walks the whole trail in batches, then holds the result against the anchors kept outside the database:
 * a cut tail, a gap, a fork, an edited entry and a head that is not the anchored one are each named with
 * their position. Entries not sealed yet are counted, not faulted.
 */
export async function verifyChain(db: Executor, key: Buffer, anchors: Anchor[], batchSize = 2000): Promise<ChainReport> {
  const issues: ChainIssue[] = [];
  let issueCount = 0;
  const report = (i: ChainIssue) => {
    issueCount++;
    if (issues.length < MAX_LISTED) issues.push(i);
  };
  const walk = makeWalk(key, report);
  let entries = 0;
  for (let after = 0; ; ) {
    const rows = await walkBatch(db, after, batchSize);
    if (!rows.length) break;
    for (const r of rows) walk.step(r);
    entries += rows.length;
    after = rows[rows.length - 1].id;
  }
  const head = walk.head;
  const end = head?.id ?? 0;
  const tail = (position: number | null, entryId: number, anchorLine: number | null, detail: string) =>
    report({ kind: 'truncated_tail', position, entryId, anchorLine, detail });
  for (const id of await orphanSeals(db)) {
    if (id > end) tail((head?.position ?? 0) + 1, id, null, `Sealed entry #${id} is gone from the end of the trail, which now ends at #${end}.`);
  }
  const sealsAt = await anchoredSeals(db, anchors.filter((a) => a.genuine).map((a) => a.id));
  for (const a of anchors) {
    const where = `The anchor of ${a.at} (line ${a.line})`;
    if (!a.genuine) {
      report({ kind: 'anchor_forged', position: null, entryId: null, anchorLine: a.line, detail: `${where} was not written with the audit key.` });
      continue;
    }
    const s = sealsAt.get(a.id);
    if (!s || !s.entry) {
      if (a.id > end) tail(null, a.id, a.line, `${where} names entry #${a.id}, but the trail now ends at #${end}: its tail was cut.`);
      else report({ kind: 'gap', position: null, entryId: a.id, anchorLine: a.line, detail: `${where} names entry #${a.id}, which is no longer in the trail.` });
    } else if (s.hmac !== a.hmac) {
      report({ kind: 'anchor_mismatch', position: null, entryId: a.id, anchorLine: a.line, detail: `${where} names entry #${a.id} with seal ${a.hmac.slice(0, 12)}…, the trail has ${s.hmac.slice(0, 12)}… there: the chain was rebuilt.` });
    }
  }
  const lastAnchor = anchors.at(-1) ?? null;
  return { intact: issueCount === 0, entries, sealed: head?.position ?? 0, unsealed: walk.unsealed, head, lastAnchor, anchors: anchors.length, issues, issueCount };
}
