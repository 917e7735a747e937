// pg_dump of one consistent snapshot, while the server keeps running: a read-only repeatable-read
// transaction exports its snapshot, counts the rows in it, and pg_dump dumps exactly that snapshot.
import { spawn } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import { countRows, schemaVersion } from './backup-manifest.js';

export interface DumpFacts {
  tables: Record<string, number>;
  schemaVersion: string;
  postgresVersion: string;
}

export async function dumpSnapshot(bin: string, ownerUrl: string, root: string, outFile: string): Promise<DumpFacts> {
  const client = new pg.Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    await client.query('begin isolation level repeatable read read only');
    const { rows } = await client.query<{ snapshot: string; version: string }>('select pg_export_snapshot() as snapshot, current_setting(\'server_version\') as version');
    const tables = await countRows(client);
    const version = await schemaVersion(client, root);
    // Custom format, owners left out (a restore must not depend on the owner's name); grants are kept.
    await run(path.join(bin, 'pg_dump'), ['--format=custom', '--no-owner', `--snapshot=${rows[0].snapshot}`, `--file=${outFile}`, `--dbname=${ownerUrl}`]);
    await client.query('commit');
    return { tables, schemaVersion: version, postgresVersion: rows[0].version };
  } finally {
    await client.end();
  }
}

export function run(exe: string, args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(exe, args, { stdio: ['ignore', 'ignore', 'pipe'], env: { ...process.env, LC_ALL: 'C.UTF-8' } });
    let err = '';
    child.stderr.on('data', (c) => (err += c));
    child.on('error', reject);
    child.on('exit', (code) => {
      if (code === 0) resolve();
      else reject(new Error(`${path.basename(exe)} failed (${code}): ${err.trim().slice(-2000)}`));
    });
  });
}
