// What a restore proves before it says it is done: the rows per table, and the audit chain checked with
// this installation's key against its anchors (the key is never in the database).
import { auditKey } from '../../server/audit/audit.hash.js';
import { readAnchors } from '../../server/audit/anchor.js';
import { verifyChain } from '../../server/audit/audit.verify.js';
import { createDatabase, createPool } from '../../server/db/client.js';
import { countRows } from './backup-manifest.js';
import { withClient } from './restore-db.js';
import { installationAuditKey, type FileDirs } from './restore-files.js';

async function counts(ownerUrl: string): Promise<Record<string, number>> {
  return withClient(ownerUrl, (c) => countRows(c));
}

async function chain(ownerUrl: string, dirs: FileDirs, log: (s: string) => void): Promise<void> {
  const hex = installationAuditKey(dirs.dataRoot);
  if (!hex) {
    log(`WARNING: this installation has no audit key (AUDIT_KEY or ${dirs.dataRoot}/audit-key). Put back the key from your ` +
      'separate copy before starting: with a new key the restored audit chain does not verify.');
    return;
  }
  const key = auditKey(hex);
  const pool = createPool(ownerUrl, 1);
  try {
    const r = await verifyChain(createDatabase(pool), key, await readAnchors(dirs.anchorDir, key));
    if (r.intact) {
      log(`audit chain verified with this installation's key: ${r.entries} entries, ${r.sealed} sealed, ${r.unsealed} to be sealed by the server`);
      return;
    }
    log(`WARNING: the audit chain does not verify with this installation's key (${r.issueCount} issue(s)); is it the key of the installation that made the backup?`);
    for (const i of r.issues.slice(0, 10)) log(`  ${i.kind}: ${i.detail}`);
  } finally {
    await pool.end();
  }
}

export const checkRestored = { counts, chain };
