#!/usr/bin/env node
// `npm test`: the same set-up as `npm start`, against a separate test database and Redis
// (.data/test, their own ports), then every suite: the lint first (ESLint and the file checks, no
// services needed), vitest (shared, web), jest (api, worker) and the browser tests against a running
// API. Exits non-zero if any suite fails.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { startAppProcesses, waitForApi } from './lib/app-processes.mjs';
import { resolveProfile, ROOT } from './lib/environment.mjs';
import { ensureNodePackages, npmRun } from './lib/node-packages.mjs';
import { fail, log } from './lib/output.mjs';
import { ensureDebianPackages, profilePackages, startProfileServices } from './lib/services.mjs';

// Tests never read .env: a developer's settings must not point the suites at real data.
const profile = resolveProfile('test');
// `npm test -- api worker` runs only the named suites (lint, shared, web, api, worker, browser);
// `npm test -- api:invitations api:mail` runs only the api test files whose path matches one of them.
const SUITES = ['lint', 'shared', 'web', 'api', 'worker', 'browser'];
// The lint suite's files, run by node's own test runner (they read files only).
const LINT_SPECS = ['deploy/scripts/lint.spec.mjs', 'deploy/scripts/env-example.spec.mjs'];
const filters = new Map();
for (const arg of process.argv.slice(2)) {
  const [name, pattern] = arg.split(':');
  if (!SUITES.includes(name)) fail(`unknown suite '${name}'; choose from ${SUITES.join(', ')}`);
  // A bare suite name runs the whole suite, whatever patterns were also given for it.
  const patterns = filters.get(name);
  filters.set(name, pattern && patterns !== null ? [...(patterns ?? []), pattern] : null);
}
const wanted = (name) => filters.size === 0 || filters.has(name);
/** The file filters a suite was given, as extra runner arguments (jest takes one regex, vitest several). */
const filterArgs = (name, runner) => {
  const patterns = filters.get(name);
  if (!patterns) return [];
  return runner === 'jest' ? ['--testPathPatterns', patterns.join('|')] : patterns;
};
const reports = path.join(profile.dataDir, 'reports');
rmSync(reports, { recursive: true, force: true });
mkdirSync(reports, { recursive: true });

ensureNodePackages();
const results = [];
if (wanted('lint')) results.push(runLintSuite());
// A lint error fails the run at once, before minutes of set-up; a run of the lint alone needs no services either.
if (results.some((r) => !r.ok) || !SUITES.some((name) => name !== 'lint' && wanted(name))) finish();

ensureDebianPackages({
  ...profilePackages(profile),
  chromium: 'chromium',
  '/usr/share/fonts/truetype/dejavu': 'fonts-dejavu-core',
  // The multi-host test stands in for other machines with network namespaces, and makes its TLS certificates.
  ip: 'iproute2',
  openssl: 'openssl',
});

let services = [];
let apps = null;
async function cleanUp() {
  await apps?.stop();
  for (const s of services.reverse()) await s.stop();
}
process.on('SIGINT', () => cleanUp().then(() => process.exit(130)));

services = await startProfileServices(profile, { fresh: true });
rmSync(path.join(profile.dataDir, 'archives'), { recursive: true, force: true });

const env = {
  ...process.env,
  NODE_ENV: 'test',
  DATABASE_URL: profile.databaseUrl,
  REDIS_URL: profile.redisUrl,
  ...profile.smtp,
  APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${profile.apiPort}/`,
  API_PORT: String(profile.apiPort),
  API_HOST: '127.0.0.1',
  WEB_DIST_DIR: path.join(ROOT, 'web/dist'),
  SESSION_SECRET: 'sixtyfold-test-session-secret',
  // Every suite signs in and mails from 127.0.0.1 with the same demo users, and the counts live in
  // Redis for the whole run; the limits' own tests start APIs with small limits of their own.
  LOGIN_THROTTLE_ADDRESS_LIMIT: '10000',
  LOGIN_THROTTLE_ACCOUNT_LIMIT: '10000',
  MAIL_MENTION_LIMIT_PER_HOUR: '10000',
  MAIL_INVITATION_LIMIT_PER_HOUR: '10000',
  // Emptied with the database below, so every archive row has its file.
  ARCHIVE_DIR: path.join(profile.dataDir, 'archives'),
  FORCE_COLOR: '0',
};

// The web bundle (and its type check) is built for a full run and for the browser tests; a run of
// only the API or worker suites skips it, since the API serves no web app in those tests.
const buildWeb = filters.size === 0 || wanted('web') || wanted('browser');
const workspaces = ['shared', 'api', 'worker', ...(buildWeb ? ['web'] : [])];
log(`building ${workspaces.join(', ')}`);
// Built without NODE_ENV, so that Vite makes a production bundle whatever the profile.
npmRun(['run', '--silent', 'build', ...workspaces.flatMap((w) => ['-w', w])], { ...env, NODE_ENV: undefined });
npmRun(['run', '--silent', 'migrate', '-w', 'api'], env);
npmRun(['run', '--silent', 'seed', '-w', 'api'], env);

/** Runs one suite; its runner writes a jest-format JSON report that the summary reads. */
function runSuite(name, args, extraEnv = {}) {
  log(`suite ${name}`);
  const report = path.join(reports, `${name}.json`);
  const result = spawnSync('npm', [...args, report], { cwd: ROOT, stdio: 'inherit', env: { ...env, ...extraEnv } });
  let passed = 0;
  let failed = 0;
  if (existsSync(report)) {
    const json = JSON.parse(readFileSync(report, 'utf8'));
    passed = json.numPassedTests ?? 0;
    failed = json.numFailedTests ?? 0;
  }
  // A runner that crashed before reporting counts as one failure, never as a pass.
  const ok = result.status === 0;
  if (!ok && failed === 0) failed = 1;
  return { name, ok, passed, failed };
}

const vitestJson = (ws, suite, script = 'test') =>
  ['run', script, '-w', ws, '--', ...filterArgs(suite, 'vitest'), '--reporter=default', '--reporter=json', '--outputFile.json'];
const jestJson = (ws) => ['run', 'test', '-w', ws, '--', ...filterArgs(ws, 'jest'), '--json', '--outputFile'];
if (wanted('shared')) results.push(runSuite('shared', vitestJson('shared', 'shared')));
if (wanted('web')) results.push(runSuite('web', vitestJson('web', 'web')));
if (wanted('api')) results.push(runSuite('api', jestJson('api')));
if (wanted('worker')) results.push(runSuite('worker', jestJson('worker')));

if (wanted('browser')) {
  log('starting the API and a worker for the browser tests');
  // The API follows finished refinement levels every 2 s (30 s by default), so a refinement chain completes within a test.
  apps = startAppProcesses({ env: { ...env, RECONCILE_INTERVAL_SECONDS: '2' }, workers: 1, quiet: true });
  if (await waitForApi(profile.apiPort, apps.api)) {
    results.push(runSuite('browser', vitestJson('web', 'browser', 'test:browser'), {
      SIXTYFOLD_WEB_URL: `http://127.0.0.1:${profile.apiPort}/`,
    }));
  } else {
    results.push({ name: 'browser', ok: false, passed: 0, failed: 1 });
    log('the API did not become healthy, so the browser tests could not run');
  }
}
await cleanUp();
finish();

/** The lint suite: node's test runner over LINT_SPECS (`lint:env` picks the files whose path contains `env`). */
function runLintSuite() {
  log('suite lint');
  const patterns = filters.get('lint');
  const files = LINT_SPECS.filter((file) => !patterns || patterns.some((p) => file.includes(p)));
  const tap = path.join(reports, 'lint.tap');
  const result = spawnSync(process.execPath, [
    '--test', '--test-reporter=spec', '--test-reporter-destination=stdout', '--test-reporter=tap', `--test-reporter-destination=${tap}`, ...files,
  ], { cwd: ROOT, stdio: 'inherit', env: { ...process.env, FORCE_COLOR: '0' } });
  const summary = existsSync(tap) ? readFileSync(tap, 'utf8') : '';
  const count = (word) => Number(summary.match(new RegExp(`^# ${word} (\\d+)$`, 'm'))?.[1] ?? 0);
  const ok = result.status === 0 && files.length > 0;
  // As in runSuite: a runner that failed without saying what counts as one failure.
  return { name: 'lint', ok, passed: count('pass'), failed: ok ? 0 : Math.max(count('fail'), 1) };
}

/** Prints each suite's counts and ends the run, non-zero if any suite failed. */
function finish() {
  const passed = results.reduce((n, r) => n + r.passed, 0);
  const failed = results.reduce((n, r) => n + r.failed, 0);
  process.stdout.write('\n');
  for (const r of results) process.stdout.write(`  ${r.ok ? 'ok  ' : 'FAIL'}  ${r.name.padEnd(8)} ${r.passed} passed, ${r.failed} failed\n`);
  const failedSuites = results.filter((r) => !r.ok).map((r) => r.name);
  if (failedSuites.length) process.stdout.write(`\n[sixtyfold] failed suites: ${failedSuites.join(', ')}\n`);
  process.stdout.write(`\ntests: ${passed} passed, ${failed} failed\n`);
  process.exit(failedSuites.length ? 1 : 0);
}
