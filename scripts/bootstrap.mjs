#!/usr/bin/env node
// Needs nothing but Node: installs the dependencies when they are missing or stale, then hands over
// to the TypeScript script for the command (start, test, dev, bench, backup, restore).
import { spawnSync, spawn } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const command = process.argv[2];
const known = ['start', 'test', 'dev', 'bench', 'backup', 'restore'];
if (!known.includes(command)) {
  console.error(`usage: node scripts/bootstrap.mjs <${known.join('|')}>`);
  process.exit(2);
}

const installed = path.join(root, 'node_modules', '.package-lock.json');
const lock = path.join(root, 'package-lock.json');
const isStale = () => !existsSync(installed) || statSync(installed).mtimeMs < statSync(lock).mtimeMs;
if (isStale()) {
  // Two commands started at once (a test run beside npm start) must not run npm ci over each other:
  // one installs while the other waits, then sees the install done.
  const guard = path.join(root, '.install-lock');
  const deadline = Date.now() + 15 * 60_000;
  for (;;) {
    try {
      mkdirSync(guard);
      break;
    } catch {
      // A guard older than the longest install is left over from a killed run.
      if (existsSync(guard) && Date.now() - statSync(guard).mtimeMs > 15 * 60_000) rmSync(guard, { recursive: true, force: true });
      if (Date.now() > deadline) break;
      spawnSync('sleep', ['1']);
    }
  }
  try {
    if (isStale()) {
      console.log('[breakover] installing dependencies (npm ci)…');
      const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
      if (r.status !== 0) {
        console.error('[breakover] npm ci failed; see the messages above');
        rmSync(guard, { recursive: true, force: true });
        process.exit(r.status ?? 1);
      }
    }
  } finally {
    rmSync(guard, { recursive: true, force: true });
  }
}

// Node itself with tsx's loader (not the tsx CLI, which adds a process of its own between us and the
// script and handles signals its own way): a Ctrl-C reaches the script, which stops what it started.
const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'scripts', `${command}.ts`), ...process.argv.slice(3)], {
  cwd: root,
  stdio: 'inherit',
});
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
