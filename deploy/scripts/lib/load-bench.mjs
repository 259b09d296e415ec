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

/**
 * `pollers` clients, each on its own keep-alive connection, polling `url` every `intervalMs` from a
 * random first moment (an open loop: the next poll is planned, not sent when the last answer came).
 * Latency runs from the planned moment. Written here because autocannon's paced mode starts every
 * connection at the same instant, which measures bursts of 100 requests rather than pollers.
 */
async function pacedPollers(url, cookie, { pollers, intervalMs, durationMs }) {
  const latencies = [];
  const codes = new Map();
  let errors = 0;
  const end = performance.now() + durationMs;
  await Promise.all(Array.from({ length: pollers }, async () => {
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    for (let planned = performance.now() + Math.random() * intervalMs; planned < end; planned += intervalMs) {
      await sleep(planned - performance.now());
      await new Promise((resolve) => {
        const req = http.get(url, { agent, headers: { cookie } }, (res) => {
          res.resume();
          res.on('end', () => {
            codes.set(res.statusCode, (codes.get(res.statusCode) ?? 0) + 1);
            latencies.push(performance.now() - planned);
            resolve();
          });
        });
        req.on('error', () => { errors++; resolve(); });
      });
    }
    agent.destroy();
  }));
  latencies.sort((a, b) => a - b);
  const at = (q) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? NaN);
  const non2xx = [...codes].filter(([code]) => code < 200 || code > 299).reduce((n, [, c]) => n + c, 0);
  return {
    requests: latencies.length, rate: latencies.length / (durationMs / 1000), codes: [...codes].map(([code, c]) => `${code}: ${c}`).join(', '),
    errors, non2xx, p50: at(0.5), p99: at(0.99), max: Math.round(latencies.at(-1) ?? NaN),
  };
}

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
    // Two runs on the same live scan. Saturating (autocannon): each connection asks again the moment
    // its answer arrives, which measures how many polls the API can answer at all. Paced: each poller
    // asks twice a second from its own random moment (the web app polls every 2 s, so this is four
    // times a real page's load, and real pages are not in step with each other), latency counted
    // from the planned moment, so a late answer also delays what follows it: what a group meets.
    const url = `${load.base}/scans/${scan.id}`;
    let report = `\npoll: 100 concurrent pollers of GET /api/scans/:id for 30 s each, ${load.workers} worker(s) computing 10^6 points\n`;
    const stored = async (run) => {
      const before = await (await fetch(url, { headers: load.headers })).json();
      const figures = await run();
      const after = await (await fetch(url, { headers: load.headers })).json();
      return { ...figures, stored: after.donePoints + after.failedPoints - (before.donePoints + before.failedPoints) };
    };
    log(`poll (saturating): 100 connections for 30 s on GET /api/scans/${scan.id} while ${load.workers} worker(s) compute`);
    const saturating = await stored(async () => {
      const r = await autocannon({ url, connections: 100, duration: 30, headers: { cookie: load.headers.cookie } });
      const codes = Object.entries(r.statusCodeStats ?? {}).map(([code, c]) => `${code}: ${c.count}`).join(', ');
      return { requests: r.requests.total, rate: r.requests.average, codes, errors: r.errors + r.timeouts, non2xx: r.non2xx, p50: r.latency.p50, p99: r.latency.p99, max: r.latency.max };
    });
    log(`poll (paced): 100 pollers, 2 polls/s each, for 30 s on GET /api/scans/${scan.id}`);
    const paced = await stored(() => pacedPollers(url, load.headers.cookie, { pollers: 100, intervalMs: 500, durationMs: 30_000 }));
    for (const [name, what, f] of [['saturating', 'each connection asks again at once', saturating], ['paced', 'each poller 2 polls/s, not in step', paced]]) {
      report +=
        `  ${name} (${what})\n` +
        `    requests        ${f.requests} (${Math.round(f.rate)}/s; status codes ${f.codes})\n` +
        `    errors          ${f.errors}, non-2xx ${f.non2xx}\n` +
        `    latency         p50 ${f.p50} ms, p99 ${f.p99} ms, max ${f.max} ms (goal: 0 errors, p99 ≤ 50 ms)\n` +
        `    points stored meanwhile  ${f.stored}\n`;
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

/**
 * Heatmap slices of a stored 1,000 × 1,000 slow-roll scan (φ^p over p × N_*, the `million` part's
 * axes), its points written straight into MariaDB with the slow-roll values n_s = 1 − (p+2)/(2N)
 * − (p+2)(p+1)/(12N²), r = 4p/N, α_s = −(p+2)/(2N²), and every 97th point failed: each slice's
 * first view (nothing cached) and repeat view, time and bytes on the wire (br, as a browser
 * asks), the page's three panels asked at once, and the scan page drawn in chromium.
 */
export async function benchHeatmap(load, { webUrl }) {
  const { MILLION_SCAN, drawPage, median3, wireGet } = await import('./million-bench.mjs');
  const res = await fetch(`${load.base}/scans`, { method: 'POST', headers: load.headers, body: JSON.stringify({ ...MILLION_SCAN, name: 'benchmark: 10^6 points, heatmaps' }) });
  const scan = await res.json();
  if (res.status !== 201) throw new Error(`the scan was refused (${res.status}): ${JSON.stringify(scan)}`);
  await cancel(load, scan.id);
  const [p, n] = MILLION_SCAN.axes;
  const { default: mysql } = await import('mysql2/promise');
  const db = await mysql.createConnection(load.databaseUrl);
  try {
    log('heatmap: storing 10^6 points');
    // A worker may still be storing the chunk it had when the cancel came (its points stay): a
    // deadlock with it is tried again.
    for (let attempt = 1; ; attempt++) {
      try {
        await storeSynthetic();
        break;
      } catch (err) {
        if (err.code !== 'ER_LOCK_DEADLOCK' || attempt === 5) throw err;
        await sleep(1000);
      }
    }
  } finally {
    await db.end();
  }
  async function storeSynthetic() {
    await db.query(
      `INSERT IGNORE INTO scan_points (scan_id, point_index, inputs, status, ns, r, alpha_s, n_star, computed_at)
       SELECT ?, seq, JSON_OBJECT('p', pp, 'nStar', nn), IF(failed, 'no_end', 'ok'),
              IF(failed, NULL, 1 - (pp + 2) / (2 * nn) - (pp + 2) * (pp + 1) / (12 * nn * nn)),
              IF(failed, NULL, 4 * pp / nn), IF(failed, NULL, -(pp + 2) / (2 * nn * nn)), IF(failed, NULL, nn), NOW(3)
         FROM (SELECT seq, ? + (seq DIV ?) * ? AS pp, ? + MOD(seq, ?) * ? AS nn, MOD(seq, 97) = 0 AS failed FROM seq_0_to_999999) AS points`,
      [scan.id, p.min, n.count, (p.max - p.min) / (p.count - 1), n.min, n.count, (n.max - n.min) / (n.count - 1)],
    );
  }
  const cookie = load.headers.cookie;
  const url = (query) => `${load.base}/scans/${scan.id}/grid?x=nStar&y=p&${query}`;
  const mb = (bytes) => `${(bytes / 1e6).toFixed(2)} MB`;
  const slices = [
    ['whole slice, 512 cells per axis', 'output=ns'],
    ['whole slice, 200 cells per axis', 'output=ns&maxCells=200'],
    ['status slice, 200 cells per axis', 'output=status&maxCells=200'],
    ['zoom window 300 × 300', 'output=ns&xFrom=100&xTo=399&yFrom=500&yTo=799'],
  ];
  let report = '\nheatmap: GET /api/scans/:id/grid on a stored 1,000 × 1,000 slice, bytes on the wire with br\n';
  // The page first (x = p, y = N_*, as it opens), so its first view finds nothing cached.
  for (const view of ['first', 'repeat']) {
    try {
      const page = await drawPage(webUrl, cookie, scan.id, { panels: 3 });
      report += `  scan page in chromium (${view} view) ${page.panels} heatmaps drawn in ${page.ms.toFixed(0)} ms, JS heap ${(page.heap / 2 ** 20).toFixed(0)} MiB\n`;
    } catch (err) {
      report += `  scan page in chromium (${view} view) not drawn: ${err.message.split('\n')[0]}\n`;
    }
  }
  report += `  ${''.padEnd(34)}first view                  repeat view (median of 3)\n`;
  for (const [label, query] of slices) {
    const first = await wireGet(url(query), cookie);
    const repeat = await median3(() => wireGet(url(query), cookie));
    report += `  ${label.padEnd(34)}${first.status} in ${first.ms.toFixed(0).padStart(5)} ms, ${mb(first.bytes)}     ${repeat.ms.toFixed(0).padStart(5)} ms\n`;
  }
  // What the page asks when it opens: three panels of 200 cells at once (n_s, r, α_s), first view
  // (the whole window spelled out, so none of it is cached from the slices above).
  const panels = ['ns', 'r', 'alphaS'].map((output) => url(`output=${output}&maxCells=200&xFrom=0&xTo=999`));
  const started = performance.now();
  const answers = await Promise.all(panels.map((u) => wireGet(u, cookie)));
  report += `  the page's three panels at once   ${answers.map((a) => a.status).join('/')} in ${(performance.now() - started).toFixed(0)} ms, ${mb(answers.reduce((b, a) => b + a.bytes, 0))}\n`;
  process.stdout.write(report);
}
