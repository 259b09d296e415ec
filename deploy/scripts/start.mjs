#!/usr/bin/env node
// `npm start`: installs what is missing, starts private MariaDB and Redis, migrates, seeds the
// demo scenario into an empty database (never with NODE_ENV=production), builds, and runs the API
// (which serves the web app) and the workers.
// Ctrl-C stops everything it started; data stays in .data/dev for the next start.
import { createRequire } from 'node:module';
import path from 'node:path';
import { startAppProcesses, waitForApi } from './lib/app-processes.mjs';
import { loadDotEnv, persistentSecret, resolveProfile, ROOT } from './lib/environment.mjs';
import { ensureNodePackages, npmRun } from './lib/node-packages.mjs';
import { fail, log } from './lib/output.mjs';
import { ensureDebianPackages, profilePackages, startProfileServices } from './lib/services.mjs';

loadDotEnv();
const profile = resolveProfile('dev');

ensureNodePackages();
ensureDebianPackages(profilePackages(profile));

let services = [];
let apps = null;
let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  await apps?.stop();
  for (const s of services.reverse()) await s.stop();
  log('stopped; data kept in .data/dev');
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

services = await startProfileServices(profile);

const env = {
  ...process.env,
  NODE_ENV: process.env.NODE_ENV ?? 'development',
  DATABASE_URL: profile.databaseUrl,
  REDIS_URL: profile.redisUrl,
  ...profile.smtp,
  APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${profile.apiPort}/`,
  API_PORT: String(profile.apiPort),
  API_HOST: process.env.API_HOST ?? '127.0.0.1',
  WEB_DIST_DIR: path.join(ROOT, 'web/dist'),
  SESSION_SECRET: process.env.SESSION_SECRET ?? persistentSecret(profile.dataDir),
  ARCHIVE_DIR: process.env.ARCHIVE_DIR ?? path.join(profile.dataDir, 'archives'),
};

log('building shared, api, worker and web');
// Built without NODE_ENV, so that Vite makes a production bundle whatever the profile.
npmRun(['run', '--silent', 'build'], { ...env, NODE_ENV: undefined });
npmRun(['run', '--silent', 'migrate', '-w', 'api'], env);
// The demo accounts share a published password: a production site never gets them.
const production = env.NODE_ENV === 'production';
if (production) log('NODE_ENV is production: the demo scenario is not seeded');
else npmRun(['run', '--silent', 'seed', '-w', 'api'], env);

log(`starting the API and ${profile.workers} worker process${profile.workers === 1 ? '' : 'es'}`);
apps = startAppProcesses({ env, workers: profile.workers });
apps.api.once('exit', (code) => { if (!stopping) { log(`the API exited (${code})`); shutdown(1); } });
if (!(await waitForApi(profile.apiPort, apps.api))) {
  await shutdown(1);
  fail('the API did not become healthy; see its output above');
}

const { DEMO_USERS, DEMO_PASSWORD } = createRequire(import.meta.url)(path.join(ROOT, 'api/dist/database/seeds/demo-scenario.js'));
const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
const demo = production
  ? ''
  : `  Demo accounts, unless the database had accounts before (password for all: ${DEMO_PASSWORD})\n` +
    DEMO_USERS.map((u) => `    ${u.email.padEnd(width)}  ${u.part}`).join('\n') +
    '\n\n';
process.stdout.write(
  `\n  Sixtyfold is running at  http://${env.API_HOST}:${profile.apiPort}/\n\n` +
    demo +
    '  Ctrl-C stops everything; data is kept in .data/dev.\n\n',
);
