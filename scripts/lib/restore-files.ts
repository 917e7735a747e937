// The files of a restore: audit anchors, the mail outbox's .eml files, and the audit key when the backup
// holds it. Nothing the installation already has is overwritten: its own copy is the more recent one.
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ANCHOR_FILE } from '../../server/audit/anchor.js';

export interface FileDirs {
  dataRoot: string;
  anchorDir: string;
  outboxDir: string;
}

export function restoreFiles(from: string, dirs: FileDirs, log: (s: string) => void): void {
  const anchors = path.join(from, ANCHOR_FILE);
  const anchorsHere = path.join(dirs.anchorDir, ANCHOR_FILE);
  if (existsSync(anchors)) {
    if (existsSync(anchorsHere)) log(`kept the installation's own ${anchorsHere} (newer than the backup's copy)`);
    else {
      mkdirSync(dirs.anchorDir, { recursive: true });
      copyFileSync(anchors, anchorsHere);
      log(`restored the audit anchors into ${anchorsHere}`);
    }
  }
  const outbox = path.join(from, 'mail-outbox');
  if (existsSync(outbox)) {
    mkdirSync(dirs.outboxDir, { recursive: true });
    let copied = 0;
    for (const f of readdirSync(outbox)) {
      if (existsSync(path.join(dirs.outboxDir, f))) continue;
      copyFileSync(path.join(outbox, f), path.join(dirs.outboxDir, f));
      copied++;
    }
    log(`restored ${copied} mail outbox file(s) into ${dirs.outboxDir}`);
  }
  const key = path.join(from, 'audit-key');
  if (existsSync(key)) restoreKey(readFileSync(key, 'utf8').trim(), dirs.dataRoot, log);
}

function restoreKey(key: string, dataRoot: string, log: (s: string) => void): void {
  const here = path.join(dataRoot, 'audit-key');
  const current = process.env.AUDIT_KEY ?? (existsSync(here) ? readFileSync(here, 'utf8').trim() : undefined);
  if (current === key) return;
  if (current) {
    log(`WARNING: the backup holds an audit key that differs from this installation's; kept this installation's. ` +
      `The restored chain verifies only with the backup's key.`);
    return;
  }
  mkdirSync(dataRoot, { recursive: true });
  writeFileSync(here, `${key}\n`, { mode: 0o600, flag: 'wx' });
  log(`restored the audit key into ${here}`);
}

/** The installation's audit key, when it has one (AUDIT_KEY, or the key file in the data folder). */
export function installationAuditKey(dataRoot: string): string | undefined {
  if (process.env.AUDIT_KEY) return process.env.AUDIT_KEY;
  const here = path.join(dataRoot, 'audit-key');
  return existsSync(here) ? readFileSync(here, 'utf8').trim() : undefined;
}
