import type { ChainIssueKind } from '../../shared/register/views.js';
import { GENESIS, sameHex, sealHmac } from './audit.hash.js';
import type { WalkRow } from './verify.repository.js';

export interface ChainIssue {
  kind: ChainIssueKind;
  position: number | null;
  entryId: number | null;
  anchorLine: number | null;
  detail: string;
}

/**
 * Follows the seals in id order. Each seal names the entry before it, so a removed entry shows as a gap
 * even where the sequence skipped numbers (rolled-back transactions); each hmac is recomputed from the
 * entry and the previous seal as stored, so an edited entry is named alone and the rest still check.
 */
export function makeWalk(key: Buffer, report: (i: ChainIssue) => void) {
  let position = 0;
  let prev: { id: number; hmac: string } = GENESIS;
  let pending: number[] = [];
  const claimed = new Set<number>();

  function step(row: WalkRow) {
    if (!row.seal) {
      pending.push(row.id);
      return;
    }
    for (const id of pending) {
      report({ kind: 'unsealed_inside', position: position + 1, entryId: id, anchorLine: null, detail: `Entry #${id} has no seal, yet entries after it are sealed: it was added behind the sealer.` });
    }
    pending = [];
    position++;
    const { prevId, hmac } = row.seal;
    if (prevId !== prev.id) {
      const from = prev.id ? `#${prev.id}` : 'the start';
      report(claimed.has(prevId)
        ? { kind: 'fork', position, entryId: row.id, anchorLine: null, detail: `Entry #${row.id}'s seal follows #${prevId}, which another seal already follows: the chain forks there.` }
        : { kind: 'gap', position, entryId: row.id, anchorLine: null, detail: `Entries are missing before #${row.id}: its seal follows #${prevId}, but the trail goes on from ${from}.` });
    } else if (!sameHex(sealHmac(key, prev, row), hmac)) {
      report({ kind: 'edited', position, entryId: row.id, anchorLine: null, detail: `Entry #${row.id} no longer matches its seal: it was changed after it was sealed, or sealed with another key.` });
    }
    claimed.add(prevId);
    prev = { id: row.id, hmac };
  }

  return {
    step,
    get head() {
      return position ? { id: prev.id, position, hmac: prev.hmac } : null;
    },
    /** Entries after the last seal: written, not yet sealed (no fault). */
    get unsealed() {
      return pending.length;
    },
  };
}
