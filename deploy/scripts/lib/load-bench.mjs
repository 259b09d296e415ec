// The API under load, for `npm run bench` (parts `poll` and `exports`): loopback only, figures only.
// Loaded after `npm ci`, so it may use the installed packages (autocannon, mysql2).
import http from 'node:http';
import { log } from './output.mjs';

const MILLION_POINTS = {
  groupId: 1, model: { kind: 'family', family: 'monomial' },
  axes: [
    { kind: 'range', parameter: 'p', min: 1, max: 3, count: 1000, spacing: 'linear' },
    { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 1000, spacing: 'linear' },
  ],
  pivot: { kind: 'fixed' }, method: 'slowroll',
};

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

async function submit({ base, headers }, name) {
  const res = await fetch(`${base}/scans`, { method: 'POST', headers, body: JSON.stringify({ ...MILLION_POINTS, name }) });
  const scan = await res.json();
  if (res.status !== 201) throw new Error(`the scan was refused (${res.status}): ${JSON.stringify(scan)}`);
  return scan;
}

async function cancel({ base, headers }, id) {
  await fetch(`${base}/scans/${id}/cancel`, { method: 'POST', headers, body: '{}' });
}

/** 100 pollers of GET /api/scans/:id for 30 s, saturating and then paced, while the workers compute a 10^6-point scan. */
export async function benchPoll(load) {
  const { default: autocannon } = await import('autocannon');
  const scan = await submit(load, 'benchmark: 10^6 points, polled');
  try {
    // Poll a scan that is really running: wait for its first stored points.
    const deadline = Date.now() + 60_000;
    for (;;) {
      const now = await (await fetch(`${load.base}/scans/${scan.id}`, { headers: load.headers })).json();
      if (now.status === 'running' && now.donePoints > 0) break;
      if (Date.now() > deadline) throw new Error(`the scan did not start in 60 s (${now.status})`);
      await sleep(250);
    }
    // Two runs on the same live scan. Saturating: each connection asks again the moment its answer
    // arrives, which measures how many polls the API can answer at all. Paced: each connection polls
    // twice a second (the web app polls every 2 s, so this is four times a real page's load),
    // latencies corrected for coordinated omission: what a group watching a scan meets.
    const runs = [
      { name: 'saturating', what: 'each connection asks again at once', options: {} },
      { name: 'paced', what: 'each connection 2 polls/s', options: { connectionRate: 2 } },
    ];
    let report = `\npoll: 100 concurrent pollers of GET /api/scans/:id for 30 s each, ${load.workers} worker(s) computing 10^6 points\n`;
    for (const run of runs) {
      log(`poll (${run.name}): 100 connections for 30 s on GET /api/scans/${scan.id} while ${load.workers} worker(s) compute`);
      const before = await (await fetch(`${load.base}/scans/${scan.id}`, { headers: load.headers })).json();
      const result = await autocannon({
        url: `${load.base}/scans/${scan.id}`, connections: 100, duration: 30, headers: { cookie: load.headers.cookie }, ...run.options,
      });
      const after = await (await fetch(`${load.base}/scans/${scan.id}`, { headers: load.headers })).json();
      const stored = after.donePoints + after.failedPoints - (before.donePoints + before.failedPoints);
      const codes = Object.entries(result.statusCodeStats ?? {}).map(([code, s]) => `${code}: ${s.count}`).join(', ');
      report +=
        `  ${run.name} (${run.what})\n` +
        `    requests        ${result.requests.total} (${result.requests.average.toFixed(0)}/s; status codes ${codes})\n` +
        `    errors          ${result.errors} (timeouts ${result.timeouts}), non-2xx ${result.non2xx}\n` +
        `    latency         p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms (goal: 0 errors, p99 ≤ 50 ms)\n` +
        `    points stored meanwhile  ${stored}\n`;
    }
    process.stdout.write(report);
  } finally {
    await cancel(load, scan.id);
  }
}

/** Resolves with [status, ms], or [null, ms] when nothing came back within `ms`. */
async function timed(url, init = {}, ms = 10_000) {
  const start = performance.now();
  try {
    const res = await fetch(url, { ...init, signal: AbortSignal.timeout(ms) });
    const body = await res.text();
    return { status: res.status, ms: performance.now() - start, body };
  } catch {
    return { status: null, ms: performance.now() - start, body: '' };
  }
}

const describe = (r) => (r.status === null ? `no answer in ${(r.ms / 1000).toFixed(0)} s` : `${r.status} in ${r.ms.toFixed(0)} ms`);

/** A download that reads its first bytes, then stops reading; `drop()` hangs up. */
function slowDownload(url, cookie) {
  return new Promise((resolve) => {
    const req = http.get(url, { headers: { cookie }, agent: false }, (res) => {
      res.once('data', () => res.pause());
      resolve({ status: res.statusCode, drop: () => req.destroy() });
    });
    req.on('error', () => resolve({ status: null, drop: () => req.destroy() }));
    // An API whose pool is taken may never answer at all.
    setTimeout(() => resolve({ status: null, drop: () => req.destroy() }), 15_000).unref();
  });
}

const VIEWERS = ['amara.okafor@halvorsen.example', 'henrik.solberg@halvorsen.example', 'lucia.marin@halvorsen.example', 'tomas.reyes@halvorsen.example'];

/**
 * Twelve viewers start a JSON export of 10^6 stored points, stop reading for 5 s, then hang up.
 * Does the API still answer health and sign-in, during and after, and how fast?
 */
export async function benchExports(load) {
  const scan = await submit(load, 'benchmark: 10^6 points, exported');
  await cancel(load, scan.id);
  const { default: mysql } = await import('mysql2/promise');
  const db = await mysql.createConnection(load.databaseUrl);
  try {
    log('exports: storing 10^6 points');
    await db.query(
      `INSERT IGNORE INTO scan_points (scan_id, point_index, inputs, status, ns, r, alpha_s, a_s, n_star, computed_at)
       SELECT ?, seq, JSON_OBJECT('p', 1 + (seq DIV 1000) * 2 / 999, 'nStar', 50 + MOD(seq, 1000) * 10 / 999), 'ok',
              0.96 + seq * 1e-9, 0.01 + seq * 1e-9, -0.0006, 2.1e-9, 50 + MOD(seq, 1000) * 10 / 999, NOW(3)
         FROM seq_0_to_999999`,
      [scan.id],
    );
  } finally {
    await db.end();
  }
  const health = `${load.base}/health`;
  const [email, password] = [load.email, load.password];
  const signIn = () => timed(`${load.base}/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  // Twelve downloads by the four people of the group who may read the scan, three each.
  const cookies = await Promise.all(VIEWERS.map(async (viewer) => {
    const res = await fetch(`${load.base}/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: viewer, password }) });
    return (res.headers.get('set-cookie') ?? '').split(';')[0];
  }));
  const url = `${load.base}/scans/${scan.id}/points?format=json`;
  const downloads = await Promise.all(Array.from({ length: 12 }, (_, i) => slowDownload(url, cookies[i % cookies.length])));
  await sleep(5000);
  const during = await timed(health);
  const started = downloads.map((d) => d.status ?? 'none in 15 s').join(',');
  for (const d of downloads) d.drop();
  const dropped = performance.now();
  await sleep(500);
  // After the hang-up: the first health answer, then sign-in and a scan read.
  const after = await timed(health, {}, 20_000);
  const recovered = performance.now() - dropped;
  const signInAfter = await signIn();
  const readAfter = await timed(`${load.base}/scans/${scan.id}`, { headers: load.headers });
  // Two downloads stay open while the bench stops the API: it must still stop at once.
  await Promise.all([0, 1].map((i) => slowDownload(url, cookies[i])));
  process.stdout.write(
    `\nexports: 12 JSON downloads of 10^6 points, each read slowly for 5 s, then dropped\n` +
      `  download answers              ${started}\n` +
      `  health while held             ${describe(during)}${during.status ? ` ${during.body}` : ''}\n` +
      `  health after the hang-up      ${describe(after)} (${(recovered / 1000).toFixed(1)} s after dropping)${after.status ? ` ${after.body}` : ''}\n` +
      `  sign-in after                 ${describe(signInAfter)}\n` +
      `  scan read after               ${describe(readAfter)}\n` +
      `  two downloads left open while the API stops (its stop time follows)\n`,
  );
}
