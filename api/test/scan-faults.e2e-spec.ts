import { afterAll, afterEach, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { pointRequest, RequestEvaluator, ScanGrid, type StoredScanSpec } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { testServices, type TestServices } from './support/services';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';

// Fault tests against the real services: a worker killed with SIGKILL, Redis killed and back
// empty, MariaDB stopped for a few seconds, each in the middle of a scan. In every case each
// point is stored exactly once and equals what the engine computes undisturbed.
const WORKER_MAIN = path.resolve('../worker/dist/main.js');

// A killed worker's chunk comes back after the bull lock expires (at most 35 s); restarts take a while.
const FAULT_TIMEOUT = 180_000;

/** SIGTERM, and SIGKILL if a worker cut off from its servers cannot shut down in time. */
const stop = (w: ChildProcess) => new Promise<void>((resolve) => {
  if (w.exitCode !== null || w.signalCode !== null) return resolve();
  const timer = setTimeout(() => w.kill('SIGKILL'), 10_000);
  w.once('exit', () => { clearTimeout(timer); resolve(); });
  w.kill('SIGTERM');
});

/** 20 × `nStarCount` Starobinsky slow-roll points: a few seconds of work on two workers. */
const starobinskyScan = (groupId: number, name: string, nStarCount: number) => ({
  groupId, name, model: { kind: 'family', family: 'starobinsky' },
  axes: [
    { kind: 'range', parameter: 'mu', min: 1e-6, max: 1e-4, count: 20, spacing: 'log' },
    { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: nStarCount, spacing: 'linear' },
  ],
  pivot: { kind: 'fixed' }, method: 'slowroll',
});

describe('scans under faults', () => {
  let t: TestApp;
  let services: TestServices;
  let plateauId: number;
  let workers: ChildProcess[] = [];

  beforeAll(async () => {
    services = await testServices();
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '0' });
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  });
  afterEach(async () => {
    // Servers back first: a failed test must not leave later suites without them, and the
    // workers need them to shut down cleanly.
    await services.startMariaDb();
    await services.startRedis();
    await Promise.all(workers.map(stop));
    workers = [];
  }, 60_000);
  afterAll(() => t.close());

  const startWorkers = (n: number) => {
    for (let i = 0; i < n; i++) workers.push(spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' }));
  };
  const storedPoints = async (id: number) => Number((await t.db.query('SELECT COUNT(*) AS n FROM scan_points WHERE scan_id = ?', [id]))[0].n);
  /** Polls the scan until it is completed; errors while a server is down count as "not yet". */
  const completed = (agent: () => ReturnType<TestApp['agent']>, id: number, what: string) =>
    until(async () => {
      const res = await agent().get(`/api/scans/${id}`).catch(() => undefined);
      return res?.body.status === 'completed' ? res.body : undefined;
    }, what);

  /** Submits a scan, starts two workers and returns once its first chunks are stored, with more to come. */
  async function scanUnderWay(agent: Awaited<ReturnType<TestApp['signIn']>>, name: string, nStarCount: number): Promise<number> {
    const created = await agent.post('/api/scans').send(starobinskyScan(plateauId, name, nStarCount));
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    startWorkers(2);
    await until(async () => ((await storedPoints(id)) >= 2000 ? true : undefined), 'the first chunks');
    expect(await storedPoints(id)).toBeLessThan(20 * nStarCount);
    return id;
  }

  /** Every point once, and a sample across chunks bit-identical to the engine run directly. */
  async function expectUndisturbedResults(id: number, total: number): Promise<void> {
    const [{ n, distinct }] = await t.db.query('SELECT COUNT(*) AS n, COUNT(DISTINCT point_index) AS `distinct` FROM scan_points WHERE scan_id = ?', [id]);
    expect(Number(n)).toBe(total);
    expect(Number(distinct)).toBe(total);
    const scan = await t.db.getRepository(Scan).findOneByOrFail({ id });
    expect({ done: scan.donePoints, failed: scan.failedPoints }).toEqual({ done: total, failed: 0 });
    const spec = scan.spec as unknown as StoredScanSpec;
    const grid = new ScanGrid(spec.axes!);
    const engine = new RequestEvaluator();
    for (const index of [0, 1999, 2000, 7777, 13_001, total - 1]) {
      const row = await t.db.getRepository(ScanPoint).findOneByOrFail({ scanId: id, pointIndex: index });
      const direct = engine.evaluate(pointRequest(spec, 'starobinsky', grid.point(index)));
      expect({ ns: row.ns, r: row.r, alphaS: row.alphaS }).toEqual({ ns: direct.ns, r: direct.r, alphaS: direct.alphaS });
    }
  }

  it('a worker killed with SIGKILL: its chunk is taken back, every point once', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    // Kill one worker once work is under way: its chunk is left half-done in bull.
    const id = await scanUnderWay(agent, 'killed worker', 1000);
    workers[0].kill('SIGKILL');

    const done = await completed(() => agent, id, 'the scan to complete after the kill');
    expect(done.progress).toMatchObject({ total: 20_000, done: 20_000, failed: 0 });
    await expectUndisturbedResults(id, 20_000);
  }, FAULT_TIMEOUT);

  it('Redis killed and back empty while the API and workers run: reconciliation finishes the scan', async () => {
    // Reconciliation on a short period here; the running API is not restarted.
    await t.close();
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '2' });
    const agent = await t.signIn(DEMO.plateauMember);
    const id = await scanUnderWay(agent, 'redis lost', 2000);
    await services.killRedisAndLoseData();
    await new Promise((r) => setTimeout(r, 2000));
    await services.startRedis();

    // The sessions went with Redis: sign in again once the API has reconnected.
    const again = await until(() => t.signIn(DEMO.plateauMember).catch(() => undefined), 'signing in after the restart');
    const done = await completed(() => again, id, 'the scan to complete after Redis came back empty');
    expect(done.progress).toMatchObject({ total: 40_000, done: 40_000, failed: 0 });
    await expectUndisturbedResults(id, 40_000);
    await t.close();
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '0' });
  }, FAULT_TIMEOUT);

  it('MariaDB stopped for a few seconds: the workers retry their chunks and finish', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const id = await scanUnderWay(agent, 'database away', 2000);
    await services.stopMariaDb();
    await new Promise((r) => setTimeout(r, 4000));
    await services.startMariaDb();

    // No reconciliation runs in this API (interval 0): the finish comes from bull's retries.
    const done = await completed(() => agent, id, 'the scan to complete after MariaDB came back');
    expect(done.progress).toMatchObject({ total: 40_000, done: 40_000, failed: 0 });
    await expectUndisturbedResults(id, 40_000);
  }, FAULT_TIMEOUT);
});
