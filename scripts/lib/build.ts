import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

function newest(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return Math.max(st.mtimeMs, ...readdirSync(p).map((f) => newest(path.join(p, f))));
}

/** Builds the client when dist/ is missing or older than what it is built from. */
export function buildClientIfStale(root: string, log: (s: string) => void): void {
  const built = path.join(root, 'dist', 'index.html');
  const sources = ['src', 'shared', 'index.html', 'vite.config.ts', 'package-lock.json', 'public'].map((p) => newest(path.join(root, p)));
  if (existsSync(built) && statSync(built).mtimeMs >= Math.max(...sources)) return;
  log('building the client (vite build)…');
  const r = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('vite build failed; see the messages above');
}

/** A build of its own for one test run, so parallel runs never serve each other's half-written dist/. */
export function buildClientInto(root: string, outDir: string): void {
  const r = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn', '--outDir', outDir, '--emptyOutDir'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('vite build failed; see the messages above');
}
