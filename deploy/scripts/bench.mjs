#!/usr/bin/env node
// `npm run bench`: the engine's own speed, then a 10,000-point slow-roll scan through the API,
// the queue, the workers and MariaDB, against the engine alone on the same cores; then the API
// under load (`poll`: 100 pollers of a running scan; `exports`: slow downloads that are dropped) and
// the heatmap slices of a stored 10^6-point scan (`heatmap`); and `million`: a 10^6-point scan
// computed end to end and read back every way (slices, pages, plane, exports, the page in chromium);
// `constraints`: exact-method scans of two families judged under every built-in likelihood set;
// `refine`: adaptive refinement of the T-model's 95 % boundary against a uniform 256 × 256 grid, in-process and through the API;
// `reproduce`: a reproducibility check of 200 points of a stored exact-method scan.
// Figures only. `npm run bench -- poll exports` runs only the parts named.
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { benchExports, benchHeatmap, benchPoll } from './lib/load-bench.mjs';
import { benchConstraints } from './lib/constraints-bench.mjs';
import { benchRefine } from './lib/refine-bench.mjs';
import { benchReproduce } from './lib/reproduce-bench.mjs';
import { benchMillion } from './lib/million-bench.mjs';
import { startAppProcesses, waitForApi } from './lib/app-processes.mjs';
import { resolveProfile, ROOT } from './lib/environment.mjs';
import { ensureNodePackages, npmRun } from './lib/node-packages.mjs';
import { fail, log } from './lib/output.mjs';
import { ensureDebianPackages, profilePackages, startProfileServices } from './lib/services.mjs';

const PARTS = ['engine', 'refine', 'reproduce', 'pipeline', 'million', 'constraints', 'poll', 'exports', 'heatmap'];
/** Parts that run in-process on the built shared package only, without the services. */
const IN_PROCESS_PARTS = ['engine'];
/** How often the API follows finished refinement levels (its reconcile interval) while benchmarking. */
const REFINE_FOLLOW_SECONDS = 2;
const asked = process.argv.slice(2);
const unknownPart = asked.find((p) => !PARTS.includes(p));
if (unknownPart) fail(`no bench part '${unknownPart}'; the parts are ${PARTS.join(', ')}`);
const runs = (part) => asked.length === 0 || asked.includes(part);

const profile = resolveProfile('bench');
ensureNodePackages();
ensureDebianPackages({ ...profilePackages(profile), ...(runs('million') ? { chromium: 'chromium' } : {}) });
npmRun(['run', '--silent', 'build'], { ...process.env, NODE_ENV: undefined });

if (runs('engine')) {
  log('engine alone');
  const engineBench = spawnSync(process.execPath, [path.join(ROOT, 'shared/bench/engine.bench.mjs')], { stdio: 'inherit' });
  if (engineBench.status !== 0) fail('the engine benchmark failed');
  log('statistics alone');
  const statisticsBench = spawnSync(process.execPath, [path.join(ROOT, 'shared/bench/grid-posterior.bench.mjs')], { stdio: 'inherit' });
  if (statisticsBench.status !== 0) fail('the statistics benchmark failed');
}
if (runs('refine')) {
  log('adaptive refinement against a uniform grid');
  const refineBench = spawnSync(process.execPath, [path.join(ROOT, 'shared/bench/refinement.bench.mjs')], { stdio: 'inherit' });
  if (refineBench.status !== 0) fail('the refinement benchmark failed');
}
if (asked.length > 0 && asked.every((part) => IN_PROCESS_PARTS.includes(part))) process.exit(0);

const services = await startProfileServices(profile, { fresh: true });
const env = {
  ...process.env, NODE_ENV: 'production', DATABASE_URL: profile.databaseUrl, REDIS_URL: profile.redisUrl, ...profile.smtp,
  API_PORT: String(profile.apiPort), API_HOST: '127.0.0.1', APP_URL: `http://127.0.0.1:${profile.apiPort}/`, WEB_DIST_DIR: path.join(ROOT, 'web/dist'),
  SESSION_SECRET: 'sixtyfold-benchmark-session-secret', FORCE_COLOR: '0',
  // Refinement levels are chained at the reconcile interval: short, so the chain's time is the workers'.
  ...(runs('refine') ? { RECONCILE_INTERVAL_SECONDS: String(REFINE_FOLLOW_SECONDS) } : {}),
};
npmRun(['run', '--silent', 'migrate', '-w', 'api'], env);
npmRun(['run', '--silent', 'seed', '-w', 'api'], { ...env, NODE_ENV: 'development' }); // the seed refuses production

const { createScanSchema, pointRequest, RequestEvaluator, ScanGrid } = await import('@sixtyfold/shared');
const { DEMO_PASSWORD } = await import(path.join(ROOT, 'api/dist/database/seeds/demo-scenario.js'));
const workers = profile.workers;
// Two 10,000-point slow-roll scans: one whose points all share one background (Starobinsky over
// its scale μ and N_*), one where each point integrates its own (φ^p over 10,000 values of p).
const pipelineScans = [
  {
    label: 'shared backgrounds', name: 'benchmark: Starobinsky over μ and N_*', model: { kind: 'family', family: 'starobinsky' },
    axes: [
      { kind: 'range', parameter: 'mu', min: 1e-6, max: 1e-4, count: 100, spacing: 'log' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 100, spacing: 'linear' },
    ],
    pivot: { kind: 'fixed' },
  },
  {
    label: 'one background each', name: 'benchmark: φ^p over 10,000 values of p', model: { kind: 'family', family: 'monomial' },
    axes: [{ kind: 'range', parameter: 'p', min: 0.5, max: 4, count: 10_000, spacing: 'linear' }],
    pivot: { kind: 'fixed', nStar: 55 },
  },
].map(({ label, ...scan }) => ({ label, body: { groupId: 1, method: 'slowroll', ...scan } }));

/**
 * The scan's points with the engine alone: on one core, then split over as many processes as there
 * are workers, running at once on the same cores (the fair yardstick for the pipeline).
 */
async function engineRates(body) {
  const family = body.model.family;
  const spec = { ...createScanSchema.parse(body), potentialSource: family };
  const grid = new ScanGrid(spec.axes);
  const engine = new RequestEvaluator();
  const start = performance.now();
  for (let i = 0; i < grid.size; i++) engine.evaluate(pointRequest(spec, family, grid.point(i)));
  const oneCore = grid.size / ((performance.now() - start) / 1000);
  const shares = await Promise.all(Array.from({ length: workers }, (_, share) => new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [path.join(ROOT, 'deploy/scripts/lib/engine-share.mjs'), JSON.stringify(body), String(share), String(workers)]);
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.on('exit', (code) => (code === 0 ? resolve(JSON.parse(out)) : reject(new Error(`engine share ${share} exited with ${code}`))));
  })));
  return { points: grid.size, oneCore, parallel: grid.size / Math.max(...shares.map((s) => s.seconds)) };
}
const engineFigures = [];
if (runs('pipeline')) for (const scan of pipelineScans) engineFigures.push(await engineRates(scan.body)); // one at a time: they share the cores

const apps = startAppProcesses({ env, workers, quiet: true });
let exitCode = 0;
try {
  if (!(await waitForApi(profile.apiPort, apps.api))) throw new Error('the API did not become healthy');
  await new Promise((r) => setTimeout(r, 2000)); // let the workers join the pool
  const base = `http://127.0.0.1:${profile.apiPort}/api`;
  const login = await fetch(`${base}/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'lucia.marin@halvorsen.example', password: DEMO_PASSWORD }),
  });
  const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0];
  const headers = { 'content-type': 'application/json', cookie };
  /** Submits a scan and waits for it; its duration runs from just before the submission to the
   *  scan's own finishedAt stamp in MariaDB, so the polling interval adds nothing. */
  const runScan = async (scanBody) => {
    const submitted = Date.now();
    const created = await (await fetch(`${base}/scans`, { method: 'POST', headers, body: JSON.stringify(scanBody) })).json();
    if (!created.id) throw new Error(`the scan was refused: ${JSON.stringify(created)}`);
    let scan;
    do {
      await new Promise((r) => setTimeout(r, 250));
      scan = await (await fetch(`${base}/scans/${created.id}`, { headers })).json();
    } while (scan.status !== 'completed' && Date.now() - submitted < 600_000);
    if (scan.status !== 'completed') throw new Error(`the scan did not complete in 10 minutes (${scan.status})`);
    return { scan, seconds: (Date.parse(scan.finishedAt) - submitted) / 1000 };
  };
  if (runs('pipeline')) {
    let report = `\nend to end: 10,000 slow-roll points, ${workers} worker process(es)\n`;
    for (const [k, { label, body }] of pipelineScans.entries()) {
      // Warm-up: each worker parses the model once and the JIT settles, as in a long scan.
      await runScan({ ...body, name: `${body.name} (warm-up)`, axes: body.axes.map((axis, a) => (a === body.axes.length - 1 ? { ...axis, count: 40 } : axis)) });
      const { scan, seconds } = await runScan(body);
      const { oneCore, parallel } = engineFigures[k];
      const pipelineRate = scan.totalPoints / seconds;
      report +=
        `  ${label}\n` +
        `    engine alone, one core        ${oneCore.toFixed(0)} points/s (×${workers} = ${(oneCore * workers).toFixed(0)})\n` +
        `    engine alone, ${workers} processes    ${parallel.toFixed(0)} points/s (the same cores, at once)\n` +
        `    API → queue → workers → DB    ${pipelineRate.toFixed(0)} points/s (${seconds.toFixed(2)} s, ${scan.donePoints} points stored)\n` +
        `    ratio to the engine alone     ${(pipelineRate / parallel).toFixed(2)}\n`;
    }
    process.stdout.write(report);
  }
  const load = { base, headers, workers, databaseUrl: profile.databaseUrl, email: 'lucia.marin@halvorsen.example', password: DEMO_PASSWORD };
  if (runs('million')) {
    const databasePid = Number(readFileSync(path.resolve(profile.dataDir, 'mariadb/run/mysqld.pid'), 'utf8'));
    await benchMillion(load, { apiPid: apps.api.pid, workerPids: apps.workers.map((w) => w.pid), databasePid, webUrl: `http://127.0.0.1:${profile.apiPort}` });
  }
  if (runs('constraints')) await benchConstraints(load);
  if (runs('refine')) await benchRefine(load, { reconcileSeconds: REFINE_FOLLOW_SECONDS });
  if (runs('reproduce')) await benchReproduce(load);
  if (runs('poll')) await benchPoll(load);
  if (runs('exports')) await benchExports(load);
  if (runs('heatmap')) await benchHeatmap(load, { webUrl: `http://127.0.0.1:${profile.apiPort}` });
} catch (err) {
  process.stderr.write(`benchmark failed: ${err.message}\n`);
  exitCode = 1;
} finally {
  const stopping = performance.now();
  await apps.stop();
  log(`the API and workers stopped in ${((performance.now() - stopping) / 1000).toFixed(1)} s`);
  for (const s of services.reverse()) await s.stop();
}
process.exit(exitCode);
