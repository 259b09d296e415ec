// `npm ci` when node_modules is missing or older than the lock file; a no-op otherwise.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ROOT } from './environment.mjs';
import { fail, log } from './output.mjs';

export function ensureNodePackages() {
  const lock = readFileSync(path.join(ROOT, 'package-lock.json'));
  const digest = createHash('sha256').update(lock).digest('hex');
  const stamp = path.join(ROOT, 'node_modules', '.sixtyfold-lock-digest');
  if (existsSync(stamp) && readFileSync(stamp, 'utf8') === digest) return;
  log('installing npm packages (npm ci)');
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { cwd: ROOT, stdio: 'inherit' });
  if (result.status !== 0) fail(`npm ci failed (exit ${result.status})`);
  writeFileSync(stamp, digest);
}

/** Runs an npm script at the root and stops the set-up if it fails. */
export function npmRun(args, env = process.env) {
  const result = spawnSync('npm', args, { cwd: ROOT, stdio: 'inherit', env });
  if (result.status !== 0) fail(`'npm ${args.join(' ')}' failed (exit ${result.status})`);
}
