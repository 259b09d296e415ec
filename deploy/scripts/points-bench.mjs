#!/usr/bin/env node
// A measure, not a test: 10^6 synthetic points of one 1,000 × 1,000 scan, inserted with
// multi-row INSERTs, then points pages (first, middle, last) under axis and output sorts and
// filters, and the n_s–r plane, read through ScanResultsService as the API reads them; beside
// them the query shapes used before the axis columns (JSON sort with OFFSET, ROW_NUMBER plane).
// Runs on the bench profile's services (BENCH_SIXTYFOLD_DB_PORT etc. move them).
import path from 'node:path';
import { resolveProfile, ROOT } from './lib/environment.mjs';
import { npmRun } from './lib/node-packages.mjs';
import { log } from './lib/output.mjs';
import { startProfileServices } from './lib/services.mjs';

const profile = resolveProfile('bench');
npmRun(['run', '--silent', 'build', '-w', 'shared', '-w', 'api']);
const services = await startProfileServices(profile, { fresh: true });
const env = {
  ...process.env, DATABASE_URL: profile.databaseUrl, REDIS_URL: profile.redisUrl, ...profile.smtp,
  SESSION_SECRET: 'sixtyfold-benchmark-session-secret', APP_URL: 'http://127.0.0.1/', NODE_ENV: 'development',
};
npmRun(['run', '--silent', 'migrate', '-w', 'api'], env);
npmRun(['run', '--silent', 'seed', '-w', 'api'], env);

const { DataSource } = await import(path.join(ROOT, 'node_modules/typeorm/index.js'));
const { buildDataSourceOptions, readDatabaseConfig, Scan } = await import(path.join(ROOT, 'api/dist/database/index.js'));
const { ScanResultsService } = await import(path.join(ROOT, 'api/dist/scans/scan-results.service.js'));
const { scanPointsQuerySchema, storedScanSpecSchema } = await import('@sixtyfold/shared');
const db = await new DataSource(buildDataSourceOptions(readDatabaseConfig(env))).initialize();

const N = 1000;
const spec = storedScanSpecSchema.parse({
  groupId: 1, name: 'measure: 10^6 points', tags: [], note: '', model: { kind: 'family', family: 'natural' }, params: {},
  axes: [
    { kind: 'range', parameter: 'f', min: 5, max: 50, count: N, spacing: 'linear' },
    { kind: 'range', parameter: 'nStar', min: 45, max: 65, count: N, spacing: 'linear' },
  ],
  pivot: { kind: 'fixed' }, method: 'slowroll', potentialSource: 'natural',
});
const [{ id: ownerId }] = await db.query('SELECT id FROM users ORDER BY id LIMIT 1');
const failed = (i) => i % 23 === 5;
let failedPoints = 0;
for (let i = 0; i < N * N; i++) if (failed(i)) failedPoints++;
const scan = await db.getRepository(Scan).save({
  groupId: 1, ownerId, name: spec.name, method: 'slowroll', status: 'completed', note: '', spec,
  totalPoints: N * N, donePoints: N * N - failedPoints, failedPoints,
});

const fValue = (k) => 5 + (45 * k) / (N - 1);
const nValue = (k) => 45 + (20 * k) / (N - 1);
let started = performance.now();
const BATCH = 5000;
for (let start = 0; start < N * N; start += BATCH) {
  const rows = [];
  for (let i = start; i < start + BATCH; i++) {
    const f = fValue(Math.floor(i / N));
    const nStar = nValue(i % N);
    const bad = failed(i);
    const ns = bad ? null : 1 - 2 / nStar - 1 / (f * f) + ((i * 7919) % 997) * 1e-7;
    const r = bad ? null : 8 / (f * f) * Math.exp(-nStar / f) + 1e-4;
    rows.push(scan.id, i, JSON.stringify({ f, nStar }), f, nStar, bad ? 'no_end' : 'ok', bad ? 'synthetic failure' : null, ns, r, bad ? null : -2 / (nStar * nStar), bad ? null : nStar, new Date());
  }
  await db.query(
    `INSERT INTO scan_points (scan_id, point_index, inputs, axis_0, axis_1, status, failure_reason, ns, r, alpha_s, n_star, computed_at) VALUES ${Array.from({ length: BATCH }, () => '(?,?,?,?,?,?,?,?,?,?,?,?)').join(',')}`,
    rows,
  );
}
const insertSeconds = (performance.now() - started) / 1000;
log(`inserted ${(N * N).toLocaleString('en-US')} points in ${insertSeconds.toFixed(1)} s (${Math.round((N * N) / insertSeconds).toLocaleString('en-US')} rows/s, every index of scan_points kept)`);
await db.query('ANALYZE TABLE scan_points');

/** Median of three runs, in ms. */
async function time(run) {
  const ms = [];
  for (let k = 0; k < 3; k++) {
    started = performance.now();
    await run();
    ms.push(performance.now() - started);
  }
  return ms.sort((a, b) => a - b)[1];
}

const service = new ScanResultsService(db, { require: async () => undefined }, null);
const user = { id: ownerId, role: 'admin' };
const pageSize = 100;
const cases = [
  { label: 'sort=input.f', query: { sort: 'input.f' }, total: N * N },
  { label: 'sort=input.nStar&order=desc', query: { sort: 'input.nStar', order: 'desc' }, total: N * N },
  { label: 'sort=ns', query: { sort: 'ns' }, total: N * N },
  { label: 'sort=r&order=desc', query: { sort: 'r', order: 'desc' }, total: N * N },
  { label: 'sort=input.nStar&input.f_min=20', query: { sort: 'input.nStar', 'input.f_min': '20' } },
  { label: 'sort=ns&status=ok', query: { sort: 'ns', status: 'ok' }, total: N * N - failedPoints },
];
const pages = (total) => [1, Math.ceil(total / pageSize / 2), Math.ceil(total / pageSize)];
for (const c of cases) {
  const total = c.total ?? (await service.page(user, scan.id, scanPointsQuerySchema.parse({ ...c.query, pageSize: '1' }))).total;
  const figures = [];
  for (const page of pages(total)) {
    figures.push(`page ${page.toLocaleString('en-US')}: ${(await time(() => service.page(user, scan.id, scanPointsQuerySchema.parse({ ...c.query, page: String(page), pageSize: String(pageSize) })))).toFixed(0)} ms`);
  }
  log(`points ${c.label} (${total.toLocaleString('en-US')} rows, ${pageSize} a page): ${figures.join(', ')}`);
}
for (const limit of [5000, 20_000]) {
  const plane = await service.plane(user, scan.id, { limit });
  const ms = await time(() => service.plane(user, scan.id, { limit }));
  log(`plane limit=${limit}: ${ms.toFixed(0)} ms, ${plane.ns.length.toLocaleString('en-US')} ok points of ${plane.okPoints.toLocaleString('en-US')} (steps ${plane.axisStrides.join(' × ')}), ${(JSON.stringify(plane).length / 1e6).toFixed(2)} MB of JSON`);
}

// Before: the JSON sort key with OFFSET over the whole scan, and the ROW_NUMBER sample of the plane.
for (const [label, key] of [['input.f (JSON)', "CAST(JSON_VALUE(p.inputs, '$.f') AS DOUBLE)"], ['ns', 'p.ns']]) {
  const figures = [];
  for (const page of pages(N * N)) {
    const ms = await time(() => db.query(`SELECT p.*, ${key} AS sort_key FROM scan_points p WHERE p.scan_id = ? ORDER BY sort_key ASC, p.point_index ASC LIMIT ? OFFSET ?`, [scan.id, pageSize, (page - 1) * pageSize]));
    figures.push(`page ${page.toLocaleString('en-US')}: ${ms.toFixed(0)} ms`);
  }
  log(`before, points sort=${label}: ${figures.join(', ')}`);
}
const stride = Math.ceil((N * N - failedPoints) / 20_000);
const beforePlane = await time(() => db.query(
  `SELECT p.point_index, p.ns, p.r, p.alpha_s, p.n_star, p.inputs
     FROM (SELECT point_index, ROW_NUMBER() OVER (ORDER BY point_index) AS k
             FROM scan_points FORCE INDEX (ix_scan_points_scan_status) WHERE scan_id = ? AND status = 'ok') ranked
     STRAIGHT_JOIN scan_points p ON p.scan_id = ? AND p.point_index = ranked.point_index
    WHERE MOD(ranked.k - 1, ?) = 0 ORDER BY ranked.point_index`,
  [scan.id, scan.id, stride],
));
log(`before, plane limit=20000 (ROW_NUMBER over the OK points): ${beforePlane.toFixed(0)} ms`);

await db.destroy();
for (const s of services.reverse()) await s.stop();
