import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import Queue from 'bull';
import http from 'node:http';
import zlib from 'node:zlib';
import { chunkSize, SCAN_QUEUE, type ComputeChunkJob } from '@sixtyfold/shared';
import { readRedisConfig } from '../src/config/redis.config';
import { DEMO_PASSWORD } from '../src/database/seeds/demo-scenario';
import { Group } from '../src/groups/entities/group.entity';
import { redisOptions } from '../src/redis/redis-client';
import { Scan } from '../src/scans/entities/scan.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';

interface Health {
  status: string;
  database: string;
  pool: { size: number; inUse: number; free: number; queued: number };
}

// 150,000 stored points, about 50 MB as JSON: far more than the socket buffers between a client
// that stopped reading and the API hold, so an export in flight really holds its connection.
const P_COUNT = 150;
const N_COUNT = 1000;
const TOTAL = P_COUNT * N_COUNT;

async function health(t: TestApp): Promise<Health> {
  const res = await fetch(`${t.url}/api/health`);
  expect(res.status).toBe(200);
  return (await res.json()) as Health;
}

/** A session cookie for raw HTTP clients, which can stop reading and hang up at will. */
async function sessionCookie(t: TestApp, email: string): Promise<string> {
  const res = await fetch(`${t.url}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  expect(res.status).toBe(200);
  return (res.headers.get('set-cookie') ?? '').split(';')[0];
}

interface HeldDownload {
  status: number;
  body: string;
  hangUp: () => void;
}

/**
 * Starts a download, reads its first bytes (or its whole answer when it is an error), then stops reading.
 * With `acceptEncoding`, the answer may come compressed: `body` is then those first bytes decoded.
 */
function holdDownload(t: TestApp, path: string, cookie: string, acceptEncoding = 'identity'): Promise<HeldDownload> {
  return new Promise((resolve, reject) => {
    const req = http.get(`${t.url}${path}`, { headers: { cookie, 'accept-encoding': acceptEncoding }, agent: false }, (res) => {
      const held = { status: res.statusCode ?? 0, hangUp: () => req.destroy() };
      // The start of a stream: decode what came, without waiting for an end.
      const text = (chunk: Buffer) =>
        res.headers['content-encoding'] === 'gzip' ? zlib.gunzipSync(chunk, { finishFlush: zlib.constants.Z_SYNC_FLUSH }).toString('utf8') : chunk.toString('utf8');
      if (res.statusCode !== 200) {
        let body = '';
        res.setEncoding('utf8').on('data', (d: string) => (body += d)).on('end', () => resolve({ ...held, body }));
        return;
      }
      res.once('data', (chunk: Buffer) => {
        res.pause();
        resolve({ ...held, body: text(chunk) });
      });
    });
    req.on('error', (err) => (req.destroyed ? undefined : reject(err)));
  });
}

async function createScanWithPoints(t: TestApp, member: Awaited<ReturnType<TestApp['signIn']>>, keepQueued = false): Promise<number> {
  const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  const created = await member.post('/api/scans').send({
    groupId, name: 'streamed exports', model: { kind: 'family', family: 'monomial' },
    axes: [
      { kind: 'range', parameter: 'p', min: 1, max: 3, count: P_COUNT, spacing: 'linear' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: N_COUNT, spacing: 'linear' },
    ],
    pivot: { kind: 'fixed' }, method: 'slowroll',
  });
  if (created.status !== 201) throw new Error(`POST /api/scans answered ${created.status}: ${JSON.stringify(created.body)}`);
  const id: number = created.body.id;
  if (keepQueued) return id;
  // No worker may compute it: its chunks leave the queue, and the points are written here.
  expect((await member.post(`/api/scans/${id}/cancel`).send({})).status).toBe(200);
  await t.db.query(
    `INSERT INTO scan_points (scan_id, point_index, inputs, axis_0, axis_1, status, ns, r, alpha_s, a_s, n_star, computed_at)
     SELECT ?, seq, JSON_OBJECT('p', p, 'nStar', nStar), p, nStar, 'ok', 0.96 + seq * 1e-9, 0.01, -0.0006, 2.1e-9, nStar, NOW(3)
       FROM (SELECT seq, 1 + (seq DIV ${N_COUNT}) * 2 / ${P_COUNT - 1} AS p, 50 + MOD(seq, ${N_COUNT}) * 10 / ${N_COUNT - 1} AS nStar
               FROM seq_0_to_${TOTAL - 1}) grid`,
    [id],
  );
  return id;
}

/** MariaDB threads still running a query over scan_points (an export abandoned but not stopped). */
async function pointQueriesRunning(t: TestApp): Promise<number> {
  const [{ n }] = await t.db.query(
    "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE '%FROM `scan_points`%' AND ID <> CONNECTION_ID()",
  );
  return Number(n);
}

describe('streamed exports that always let go', () => {
  let t: TestApp;
  let scanId: number;
  let cookie: string;

  beforeAll(async () => {
    t = await createTestApp({ DATABASE_POOL_SIZE: '4', EXPORT_STALL_SECONDS: '1', EXPORTS_PER_USER: '3', EXPORTS_PER_SITE: '3' });
    scanId = await createScanWithPoints(t, await t.signIn(DEMO.plateauMember));
    cookie = await sessionCookie(t, DEMO.plateauMember);
  }, 120_000);
  afterAll(async () => {
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it('returns the connection at once when a client hangs up mid-export', async () => {
    expect((await health(t)).pool.inUse).toBe(0);
    const download = await holdDownload(t, `/api/scans/${scanId}/points?format=json`, cookie);
    expect(download.status).toBe(200);
    expect(download.body.startsWith('[')).toBe(true);
    // While the client holds it, the export holds a connection and its query runs.
    expect((await health(t)).pool.inUse).toBe(1);
    expect(await pointQueriesRunning(t)).toBe(1);
    download.hangUp();
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'the pool to get its connection back', 10_000);
    await until(async () => ((await pointQueriesRunning(t)) === 0 ? true : undefined), 'MariaDB to drop the query', 10_000);
    expect((await health(t)).pool).toMatchObject({ size: 4, inUse: 0, free: 4, queued: 0 });
  });

  it('ends a CSV export whose client stops reading, and frees its connection', async () => {
    const download = await holdDownload(t, `/api/scans/${scanId}/points?format=csv&sort=ns&order=desc`, cookie);
    expect(download.status).toBe(200);
    expect(download.body.split('\n').filter((l) => !l.startsWith('#'))[0]).toBe('pointIndex,p,nStar,status,failureReason,ns,r,alphaS,As,amplitudeScale,nTotal,phiStar,phiEnd,energyScaleGeV');
    expect((await health(t)).pool.inUse).toBe(1);
    // The client never reads again nor hangs up: the API ends it after the stall time (1 s here).
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'the pool to get its connection back', 10_000);
    await until(async () => ((await pointQueriesRunning(t)) === 0 ? true : undefined), 'MariaDB to drop the query', 10_000);
    download.hangUp();
  });

  it('sends a gzip export\'s first rows at once, and lets go when its client hangs up', async () => {
    const download = await holdDownload(t, `/api/scans/${scanId}/points?format=csv&sort=ns&order=desc`, cookie, 'gzip');
    expect(download.status).toBe(200);
    // The first piece the client got already decodes to the header and rows: compression flushes as it goes.
    const lines = download.body.split('\n').filter((l) => !l.startsWith('#'));
    expect(lines[0]).toBe('pointIndex,p,nStar,status,failureReason,ns,r,alphaS,As,amplitudeScale,nTotal,phiStar,phiEnd,energyScaleGeV');
    expect(lines.length).toBeGreaterThan(2);
    expect(lines[1]).toMatch(new RegExp(`^${TOTAL - 1},3,60,ok,,`));
    download.hangUp();
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'the pool to get its connection back', 10_000);
    await until(async () => ((await pointQueriesRunning(t)) === 0 ? true : undefined), 'MariaDB to drop the query', 10_000);
  });

  it('still signs people in and reads scans after thirty cancelled exports in a row', async () => {
    for (let i = 0; i < 30; i++) {
      const format = i % 2 ? 'csv' : 'json';
      const download = await holdDownload(t, `/api/scans/${scanId}/points?format=${format}`, cookie);
      expect(download.status).toBe(200);
      download.hangUp();
    }
    const member = await t.signIn(DEMO.plateauMember);
    expect((await member.get(`/api/scans/${scanId}`)).status).toBe(200);
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'the pool to get every connection back', 10_000);
    await until(async () => ((await pointQueriesRunning(t)) === 0 ? true : undefined), 'MariaDB to drop the queries', 10_000);
  });

  it('still streams a whole export to a client that reads it', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const res = await member.get(`/api/scans/${scanId}/points?format=json&nStar_min=0&input.p_max=1.02`);
    expect(res.status).toBe(200);
    const points = JSON.parse(res.text) as { pointIndex: number }[];
    // p = 1 + k·2/149 ≤ 1.02 for k = 0 and 1: two rows of the grid.
    expect(points).toHaveLength(2 * N_COUNT);
    expect((await health(t)).pool.inUse).toBe(0);
  });
});

describe('export limits', () => {
  let t: TestApp;
  let scanId: number;

  beforeAll(async () => {
    t = await createTestApp({ DATABASE_POOL_SIZE: '4', EXPORTS_PER_USER: '2', EXPORTS_PER_SITE: '3', EXPORT_STALL_SECONDS: '600' });
    scanId = await createScanWithPoints(t, await t.signIn(DEMO.plateauMember));
  }, 120_000);
  afterAll(async () => {
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it('answers 429 with a message beyond the per-person and the site-wide limits', async () => {
    const member = await sessionCookie(t, DEMO.plateauMember);
    const lead = await sessionCookie(t, DEMO.plateauLead);
    const viewer = await sessionCookie(t, DEMO.plateauViewer);
    const path = `/api/scans/${scanId}/points?format=csv`;
    const held = [await holdDownload(t, path, member), await holdDownload(t, path, member)];
    expect(held.map((d) => d.status)).toEqual([200, 200]);
    const third = await holdDownload(t, path, member);
    expect(third.status).toBe(429);
    expect(JSON.parse(third.body).message).toMatch(/You already have 2 downloads running/);
    const lead1 = await holdDownload(t, path, lead);
    expect(lead1.status).toBe(200);
    const siteFull = await holdDownload(t, path, viewer);
    expect(siteFull.status).toBe(429);
    expect(JSON.parse(siteFull.body).message).toMatch(/3 downloads are running, the most this server runs at once/);
    for (const d of [...held, lead1]) d.hangUp();
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'the pool to get its connections back', 10_000);
    // Freed: the same person may download again.
    const again = await holdDownload(t, path, member);
    expect(again.status).toBe(200);
    again.hangUp();
  });
});

describe('a taken database pool', () => {
  let t: TestApp;
  let scanId: number;

  beforeAll(async () => {
    t = await createTestApp({
      DATABASE_POOL_SIZE: '2', DATABASE_QUEUE_LIMIT: '3', DATABASE_ACQUIRE_TIMEOUT_MS: '1500', EXPORTS_PER_USER: '5', EXPORTS_PER_SITE: '5', EXPORT_STALL_SECONDS: '600',
    });
    scanId = await createScanWithPoints(t, await t.signIn(DEMO.plateauMember));
  }, 120_000);
  afterAll(async () => {
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it('answers 503 with a message when the pool is taken, never hangs, and says so in health', async () => {
    const member = await sessionCookie(t, DEMO.plateauMember);
    const lead = await sessionCookie(t, DEMO.plateauLead);
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'an idle pool', 10_000);
    const held = [await holdDownload(t, `/api/scans/${scanId}/points?format=json`, member), await holdDownload(t, `/api/scans/${scanId}/points?format=json`, lead)];
    expect(held.map((d) => d.status)).toEqual([200, 200]);
    const busy = await health(t);
    expect(busy).toMatchObject({ status: 'saturated', database: 'saturated', pool: { size: 2, inUse: 2, free: 0 } });
    // Five reads at once: up to three wait their 1.5 s and give up, the rest find the queue full
    // (the API's own timers may hold a place in the queue too, hence "at least one" of each).
    const reads = await Promise.all([0, 1, 2, 3, 4].map(() => fetch(`${t.url}/api/scans/${scanId}`, { headers: { cookie: member } })));
    const answers = await Promise.all(reads.map(async (r) => ({ status: r.status, message: ((await r.json()) as { message: string }).message })));
    expect(answers.map((a) => a.status)).toEqual([503, 503, 503, 503, 503]);
    const waited = answers.filter((a) => /^The database is busy: no database connection came free within 1500 ms/.test(a.message));
    const refused = answers.filter((a) => /^The database is busy: too many requests are already waiting/.test(a.message));
    expect(waited.length).toBeGreaterThanOrEqual(1);
    expect(refused.length).toBeGreaterThanOrEqual(1);
    expect(waited.length + refused.length).toBe(5);
    for (const d of held) d.hangUp();
    await until(async () => ((await health(t)).pool.inUse === 0 ? true : undefined), 'the pool to get its connections back', 10_000);
    expect((await fetch(`${t.url}/api/scans/${scanId}`, { headers: { cookie: member } })).status).toBe(200);
    expect((await health(t)).status).toBe('ok');
  });
});

describe('progress while chunks start and finish', () => {
  let t: TestApp;
  let scanId: number;
  let queue: Queue.Queue<ComputeChunkJob>;

  beforeAll(async () => {
    t = await createTestApp();
    scanId = await createScanWithPoints(t, await t.signIn(DEMO.plateauMember), true);
    queue = new Queue<ComputeChunkJob>(SCAN_QUEUE, { redis: redisOptions(readRedisConfig()) });
  }, 120_000);
  afterAll(async () => {
    await queue.obliterate({ force: true });
    await queue.close();
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it('counts the chunks a worker holds, and never fails while jobs finish around the poll', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const size = chunkSize(TOTAL, 'slowroll');
    // Take three chunks as a worker would.
    const taken: Queue.Job<ComputeChunkJob>[] = [];
    for (let i = 0; i < 3; i++) {
      const job = await queue.getNextJob();
      if (!job) throw new Error('no chunk waiting');
      expect(job.data.scanId).toBe(scanId);
      taken.push(job);
    }
    const running = await member.get(`/api/scans/${scanId}`);
    expect(running.status).toBe(200);
    expect(running.body.progress.running).toBe(3 * size);
    expect(running.body.progress.queued).toBe(TOTAL - 3 * size);

    // Workers take and finish chunks (removed on completion) while many polls read the progress.
    const polls: Promise<{ status: number; running: number }>[] = [];
    // As many rounds as leave a chunk or two on the queue (16 chunks of this scan).
    const rounds = Math.ceil(TOTAL / size) - 4;
    expect(rounds).toBeGreaterThanOrEqual(10);
    for (let round = 0; round < rounds; round++) {
      for (let i = 0; i < 5; i++) polls.push(member.get(`/api/scans/${scanId}`).then((r) => ({ status: r.status, running: r.body.progress?.running })));
      const next = await queue.getNextJob();
      if (next) taken.push(next);
      const done = taken.shift()!;
      await done.moveToCompleted('stored', true, true);
    }
    const answers = await Promise.all(polls);
    expect(answers.filter((a) => a.status !== 200)).toEqual([]);
    for (const a of answers) expect(a.running % size).toBe(0);
    for (const job of taken) await job.moveToCompleted('stored', true, true);
    const after = await member.get(`/api/scans/${scanId}`);
    expect(after.body.progress.running).toBe(0);
  });
});
