import { appendFile, mkdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { Deps } from '../deps.js';
import { anchorMac, sameHex } from './audit.hash.js';
import { mailAnchor } from './anchor.mail.js';

export const ANCHOR_FILE = 'audit-anchors.log';

export interface Anchor {
  /** 1-based line number in the anchor file. */
  line: number;
  at: string;
  id: number;
  hmac: string;
  /** The line's own HMAC matches: it was written with the audit key. */
  genuine: boolean;
}

const fileIn = (dir: string) => path.join(dir, ANCHOR_FILE);

/** Every anchor line, oldest first; none when the file does not exist yet. */
export async function readAnchors(dir: string, key: Buffer): Promise<Anchor[]> {
  const text = await readFile(fileIn(dir), 'utf8').catch((e: NodeJS.ErrnoException) => {
    if (e.code === 'ENOENT') return '';
    throw e;
  });
  return text.split('\n').filter((l) => l.trim()).map((l, i) => {
    const [at = '', id = '', hmac = '', mac = ''] = l.split('\t');
    const n = Number(id);
    return { line: i + 1, at, id: n, hmac, genuine: Number.isSafeInteger(n) && sameHex(mac, anchorMac(key, at, n, hmac)) };
  });
}

/**
 * Records the sealed head outside the database: a line appended to the anchor file when the head moved,
 * and the day's e-mail to the admins (once a day whatever the number of runs). A database superuser
 * alone can then neither cut the tail nor rebuild the chain without the anchors saying so.
 */
export async function writeAnchor(deps: Deps, key: Buffer, head: { id: number; hmac: string }): Promise<Anchor> {
  const dir = deps.config.audit.anchorDir;
  const anchors = await readAnchors(dir, key);
  let last = anchors.at(-1);
  if (!last || last.id !== head.id || last.hmac !== head.hmac) {
    const at = deps.clock.now().toISOString();
    await mkdir(dir, { recursive: true });
    await appendFile(fileIn(dir), `${at}\t${head.id}\t${head.hmac}\t${anchorMac(key, at, head.id, head.hmac)}\n`, { mode: 0o600 });
    last = { line: anchors.length + 1, at, id: head.id, hmac: head.hmac, genuine: true };
  }
  await mailAnchor(deps, last);
  return last;
}
