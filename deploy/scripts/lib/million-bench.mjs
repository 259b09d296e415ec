// `npm run bench -- million`: one 1,000 × 1,000 slow-roll scan (φ^p over p × N_*) computed by the
// workers through the API, the queue and MariaDB, then read back the ways people read it: heatmap
// slices, points pages, the n_s–r plane (and four at once, as compare asks), exports per format,
// and the scan page drawn in chromium. Figures only; the tests assert the behaviour.
import http from 'node:http';
import { readFileSync } from 'node:fs';
import { log } from './output.mjs';

const SIDE = 1000;
export const MILLION_SCAN = {
  groupId: 1, name: 'benchmark: φ^p over p × N_*, 10^6 points', model: { kind: 'family', family: 'monomial' },
  axes: [
    { kind: 'range', parameter: 'p', min: 0.5, max: 4, count: SIDE, spacing: 'linear' },
    { kind: 'range', parameter: 'nStar', min: 45, max: 65, count: SIDE, spacing: 'linear' },
  ],
  pivot: { kind: 'fixed' }, method: 'slowroll',
};

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const mb = (bytes) => `${(bytes / 1e6).toFixed(2)} MB`;
const ms = (x) => `${x.toFixed(0)} ms`;

/** Resident memory of a process in bytes (0 once it is gone). */
function residentBytes(pid) {
  try {
    const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return match ? Number(match[1]) * 1024 : 0;
  } catch {
    return 0;
  }
}

/** CPU time a process has used, user and system, in seconds (0 once it is gone). */
function cpuSeconds(pid) {
  try {
    // /proc/<pid>/stat: "pid (name) state …"; utime and stime are the 12th and 13th fields after the name, in ticks of 1/100 s.
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return 0;
  }
}

/** Samples the resident memory of named processes every 250 ms; `stop()` returns each one's peak. */
function samplePeaks(processes) {
  const peaks = new Map(processes.map(([name]) => [name, 0]));
  const timer = setInterval(() => {
    for (const [name, pid] of processes) peaks.set(name, Math.max(peaks.get(name), residentBytes(pid)));
  }, 250);
  return { stop: () => { clearInterval(timer); return peaks; } };
}

/** GET with the encodings a browser offers; times the whole answer and counts the bytes on the wire. */
export function wireGet(url, cookie, encoding = 'br, gzip') {
  return new Promise((resolve, reject) => {
    const start = performance.now();
    const req = http.get(url, { headers: { cookie, 'accept-encoding': encoding } }, (res) => {
      let bytes = 0;
      res.on('data', (d) => (bytes += d.length));
      res.on('end', () => resolve({ status: res.statusCode, ms: performance.now() - start, bytes, encoding: res.headers['content-encoding'] ?? 'none' }));
    });
    req.on('error', reject);
    req.setTimeout(600_000, () => req.destroy(new Error(`no answer from ${url}`)));
  });
}

/** The median of three runs of `run`. */
export async function median3(run) {
  const runs = [];
  for (let i = 0; i < 3; i++) runs.push(await run());
  return runs.sort((a, b) => a.ms - b.ms)[1];
}

async function submitAndWait({ base, headers }, onSubmitted) {
  const submitted = Date.now();
  const res = await fetch(`${base}/scans`, { method: 'POST', headers, body: JSON.stringify(MILLION_SCAN) });
  const created = await res.json();
  if (res.status !== 201) throw new Error(`the scan was refused (${res.status}): ${JSON.stringify(created)}`);
  const watching = onSubmitted(created.id);
  let scan;
  do {
    await sleep(1000);
    scan = await (await fetch(`${base}/scans/${created.id}`, { headers })).json();
  } while (scan.status !== 'completed' && Date.now() - submitted < 1_800_000);
  if (scan.status !== 'completed') throw new Error(`the scan did not complete in 30 minutes (${scan.status}, ${scan.donePoints} points)`);
  return { scan, seconds: (Date.parse(scan.finishedAt) - submitted) / 1000, watching };
}

/**
 * Opens the scan page in chromium while the scan computes and records the page's long tasks (main
 * thread busy > 50 ms) until `done` resolves: is the page still responsive as the scan fills in?
 */
async function watchLive(webUrl, cookie, scanId, done) {
  const { openChromium } = await import('./chromium.mjs');
  const browser = await openChromium(webUrl, cookie);
  try {
    await browser.page.addInitScript(() => {
      globalThis.__longTasks = [];
      new PerformanceObserver((list) => { for (const e of list.getEntries()) globalThis.__longTasks.push(e.duration); }).observe({ type: 'longtask', buffered: true });
    });
    await browser.page.goto(`${webUrl}/scans/${scanId}`);
    await done;
    const tasks = await browser.page.evaluate(() => globalThis.__longTasks);
    return { count: tasks.length, longest: Math.max(0, ...tasks), total: tasks.reduce((a, b) => a + b, 0) };
  } finally {
    await browser.close();
  }
}

/**
 * Loads the finished scan's page in a fresh chromium tab: time until its heatmaps are drawn (at
 * least `panels` of them), and the JS heap then.
 */
export async function drawPage(webUrl, cookie, scanId, { panels = 1 } = {}) {
  const { openChromium } = await import('./chromium.mjs');
  const browser = await openChromium(webUrl, cookie);
  try {
    const { page } = browser;
    const start = performance.now();
    await page.goto(`${webUrl}/scans/${scanId}`);
    const heatmaps = page.getByRole('img', { name: /^Heatmap of/ });
    await heatmaps.nth(panels - 1).waitFor({ timeout: 120_000 });
    const count = await heatmaps.count();
    for (let i = 0; i < count; i++) await heatmaps.nth(i).locator('.main-svg').first().waitFor({ timeout: 120_000 });
    const drawn = performance.now() - start;
    const heap = await page.evaluate(() => performance.memory?.usedJSHeapSize ?? 0);
    return { ms: drawn, panels: count, heap };
  } finally {
    await browser.close();
  }
}

export async function benchMillion(load, { apiPid, workerPids, databasePid, webUrl }) {
  const cookie = load.headers.cookie;
  const memory = samplePeaks([['API', apiPid], ...workerPids.map((pid, i) => [`worker ${i + 1}`, pid]), ['MariaDB', databasePid]]);
  let report = `\nmillion: 1,000 × 1,000 slow-roll points (φ^p, p × N_*), ${workerPids.length} workers\n`;
  const endToEnd = (scan, seconds) => `${(scan.totalPoints / seconds).toFixed(0)} points/s (${seconds.toFixed(1)} s, ${scan.donePoints} ok, ${scan.failedPoints} failed)`;

  log('million: computing it with nobody watching');
  const processes = [['API', apiPid], ...workerPids.map((pid, i) => [`worker ${i + 1}`, pid]), ['MariaDB', databasePid]];
  const cpuBefore = processes.map(([, pid]) => cpuSeconds(pid));
  const alone = await submitAndWait(load, async () => null);
  const cpu = processes.map(([name, pid], k) => `${name} ${(cpuSeconds(pid) - cpuBefore[k]).toFixed(1)} s`);
  report += `  end to end, nobody watching    ${endToEnd(alone.scan, alone.seconds)}\n`;
  report += `    CPU time spent               ${cpu.join(', ')}\n`;

  // Again, with the scan page open in chromium from submission to the end, as a group watches.
  log('million: computing it again with the scan page open');
  let finished;
  const done = new Promise((resolve) => (finished = resolve));
  const computing = submitAndWait(load, (id) => watchLive(webUrl, cookie, id, done).catch((err) => ({ error: err.message })));
  const { scan, seconds, watching: watched } = await computing.finally(() => finished());
  const watching = await watched;
  const peaks = memory.stop();
  report += `  end to end, page open          ${endToEnd(scan, seconds)}\n`;
  report += watching.error
    ? `  page while live                could not watch: ${watching.error}\n`
    : `  page while live                ${watching.count} long tasks (> 50 ms), longest ${ms(watching.longest)}, ${ms(watching.total)} in all\n`;
  report += `  peak memory (both runs)        ${[...peaks].map(([name, bytes]) => `${name} ${(bytes / 2 ** 20).toFixed(0)} MiB`).join(', ')}\n`;
  const base = `${load.base}/scans/${scan.id}`;

  log('million: reading it back');
  report += '  heatmap slice (median of 3, on the wire with br/gzip)\n';
  for (const [label, query] of [
    ['whole, 512 cells per axis', 'output=ns'],
    ['whole, 200 cells per axis', 'output=ns&maxCells=200'],
    ['status, 512 cells per axis', 'output=status'],
    ['zoom window 300 × 300', 'output=ns&xFrom=100&xTo=399&yFrom=500&yTo=799'],
  ]) {
    const r = await median3(() => wireGet(`${base}/grid?x=nStar&y=p&${query}`, cookie));
    report += `    ${label.padEnd(29)}${r.status} in ${ms(r.ms)}, ${mb(r.bytes)} (${r.encoding})\n`;
  }

  report += '  points pages of 100 (median of 3): first / middle / last of the matching points\n';
  for (const [label, query] of [
    ['sort by p', 'sort=input.p'],
    ['sort by n_s', 'sort=ns'],
    ['sort by r, descending', 'sort=r&order=desc'],
    ['sort by φ_end (no index)', 'sort=phiEnd'],
    ['filter N_* ≥ 60, sort by n_s', 'sort=ns&input.nStar_min=60'],
    ['filter n_s 0.96–0.97, sort by p', 'sort=input.p&ns_min=0.96&ns_max=0.97'],
  ]) {
    const { total } = await (await fetch(`${base}/points?${query}&pageSize=1`, { headers: load.headers })).json();
    const pages = Math.max(1, Math.ceil(total / 100));
    const times = [];
    for (const page of [1, Math.ceil(pages / 2), pages]) {
      const r = await median3(() => wireGet(`${base}/points?${query}&pageSize=100&page=${page}`, cookie));
      times.push(r.status === 200 ? ms(r.ms) : `${r.status}`);
    }
    report += `    ${label.padEnd(33)}${times.join(' / ')} (${total.toLocaleString('en-US')} points)\n`;
  }

  const plane = await median3(() => wireGet(`${base}/plane`, cookie));
  report += `  n_s–r plane                    ${plane.status} in ${ms(plane.ms)}, ${mb(plane.bytes)}\n`;
  const fourStart = performance.now();
  await Promise.all([0, 1, 2, 3].map(() => wireGet(`${base}/plane`, cookie)));
  report += `  four planes at once (compare)  ${ms(performance.now() - fourStart)}\n`;

  report += '  export of every point (no compression)\n';
  for (const format of ['csv', 'json', 'arrow']) {
    const r = await wireGet(`${base}/points?format=${format}`, cookie, 'identity');
    report += `    ${format.padEnd(29)}${r.status}: ${(scan.totalPoints / (r.ms / 1000)).toFixed(0)} rows/s (${(r.ms / 1000).toFixed(1)} s, ${mb(r.bytes)})\n`;
  }
  const gz = await wireGet(`${base}/points?format=csv`, cookie, 'gzip');
  report += `    csv, gzip                    ${gz.status}: ${(scan.totalPoints / (gz.ms / 1000)).toFixed(0)} rows/s (${(gz.ms / 1000).toFixed(1)} s, ${mb(gz.bytes)})\n`;

  try {
    const page = await drawPage(webUrl, cookie, scan.id);
    report += `  scan page in chromium          ${page.panels} heatmaps drawn in ${ms(page.ms)}, JS heap ${(page.heap / 2 ** 20).toFixed(0)} MiB\n`;
  } catch (err) {
    report += `  scan page in chromium          not drawn: ${err.message.split('\n')[0]}\n`;
  }
  process.stdout.write(report);
}
