// The backup file: one tar of a staging folder (dump, files, manifest.json), and FILE.sha256 beside it
// in sha256sum's format, so `sha256sum -c FILE.sha256` checks it without Breakover.
import { spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdtempSync, readFileSync, readdirSync, renameSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, sha256File, type Manifest, type Member } from './backup-manifest.js';

function tar(args: string[]): void {
  const r = spawnSync('tar', args, { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`tar ${args[0]} failed: ${(r.stderr || r.error?.message || '').trim()}`);
}

/** Every file under the folder, as paths relative to it (the manifest itself left out). */
export function filesUnder(dir: string, sub = ''): string[] {
  return readdirSync(path.join(dir, sub), { withFileTypes: true }).flatMap((e) => {
    const rel = path.posix.join(sub, e.name);
    if (e.isDirectory()) return filesUnder(dir, rel);
    return rel === 'manifest.json' ? [] : [rel];
  });
}

export async function membersOf(staging: string): Promise<Member[]> {
  const out: Member[] = [];
  for (const rel of filesUnder(staging).sort()) {
    const file = path.join(staging, rel);
    out.push({ path: rel, bytes: statSync(file).size, sha256: await sha256File(file) });
  }
  return out;
}

/** Packs the staging folder into `out` (written beside it first, then renamed: a cut-off run leaves no backup-looking file). */
export async function writeArchive(staging: string, manifest: Manifest, out: string): Promise<string> {
  writeFileSync(path.join(staging, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  const partial = `${out}.partial`;
  tar(['-cf', partial, '-C', staging, 'manifest.json', ...manifest.members.map((m) => m.path)]);
  chmodSync(partial, 0o600); // every record and evidence file of the workshop: for the owner's eyes only
  renameSync(partial, out);
  const sum = await sha256File(out);
  writeFileSync(`${out}.sha256`, `${sum}  ${path.basename(out)}\n`);
  return sum;
}

/**
 * Checks FILE against FILE.sha256, unpacks it into a new temporary folder and checks every member against
 * the manifest. Throws with what is wrong; nothing is restored from a file that fails any check.
 */
export async function openArchive(file: string): Promise<{ dir: string; manifest: Manifest }> {
  if (!existsSync(file)) throw new Error(`${file} does not exist`);
  const sumFile = `${file}.sha256`;
  if (!existsSync(sumFile)) throw new Error(`${sumFile} is missing: keep the checksum file beside the backup (it is written with it)`);
  const expected = readFileSync(sumFile, 'utf8').trim().split(/\s+/)[0]?.toLowerCase();
  const actual = await sha256File(file);
  if (expected !== actual) {
    throw new Error(`${file} is corrupted: its SHA-256 is ${actual}, but ${path.basename(sumFile)} says ${expected}. Use another copy.`);
  }
  const dir = mkdtempSync(path.join(os.tmpdir(), 'breakover-restore-'));
  tar(['-xf', file, '-C', dir]);
  const manifestFile = path.join(dir, 'manifest.json');
  if (!existsSync(manifestFile)) throw new Error(`${file} holds no manifest.json: it is not a Breakover backup`);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest;
  if (manifest.format !== BACKUP_FORMAT || manifest.formatVersion !== BACKUP_FORMAT_VERSION) {
    throw new Error(`${file} is not a Breakover backup of format ${BACKUP_FORMAT_VERSION} (it says ${manifest.format} ${manifest.formatVersion})`);
  }
  const listed = new Set(manifest.members.map((m) => m.path));
  const extra = filesUnder(dir).filter((f) => !listed.has(f));
  if (extra.length) throw new Error(`${file} holds files its manifest does not list: ${extra.join(', ')}`);
  for (const m of manifest.members) {
    const at = path.join(dir, m.path);
    if (!existsSync(at)) throw new Error(`${file} lacks ${m.path}, which its manifest lists`);
    const sum = await sha256File(at);
    if (sum !== m.sha256 || statSync(at).size !== m.bytes) throw new Error(`${m.path} in ${file} is corrupted: its SHA-256 is ${sum}, the manifest says ${m.sha256}`);
  }
  return { dir, manifest };
}
