import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { scanChunks, scanPlaneSchema, workerPoolSchema, type ScanPointDto, type WorkerPool } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const WORKER_MAIN = path.resolve('../worker/dist/main.js');

// φ_init = 16 for λφ^p: about 127 e-folds for p = 1, 63 for p = 2 and 42 for p = 3, so of
// N_* from 50 to 90 some points are OK and some fail, mixed through the grid.
const AXES = [
  { kind: 'list', parameter: 'p', values: [1, 2, 3] },
  { kind: 'range', parameter: 'nStar', min: 50, max: 90, count: 10, spacing: 'linear' },
];

describe('the n_s–r plane of a scan and the worker pool', () => {
  let t: TestApp;
  let member: Agent;
  let scanId: number;
  let okPoints: ScanPointDto[];
  let poolBefore: WorkerPool;
  const workers: ChildProcess[] = [];

  beforeAll(async () => {
    t = await createTestApp();
    const plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    member = await t.signIn(DEMO.plateauMember);
    const created = await member.post('/api/scans').send({
      groupId: plateauId, name: 'plane of a mixed scan', model: { kind: 'family', family: 'monomial' }, phiInit: 16,
      axes: AXES, pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    if (created.status !== 201) throw new Error(`POST /api/scans answered ${created.status}: ${JSON.stringify(created.body)}`);
    scanId = created.body.id;
    // No worker yet: the scan's chunks wait in the queue.
    poolBefore = (await member.get('/api/workers/pool')).body;
    for (let i = 0; i < 2; i++) workers.push(spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' }));
    const done = await until(async () => {
      const res = await member.get(`/api/scans/${scanId}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the scan to complete');
    if (!(done.donePoints > 2 && done.failedPoints > 2)) throw new Error(`expected OK and failed points, got ${JSON.stringify(done.progress)}`);
    const page = await member.get(`/api/scans/${scanId}/points?status=ok&sort=pointIndex&pageSize=1000`);
    okPoints = page.body.items;
  }, 120_000);
  afterAll(async () => {
    await Promise.all(workers.map((w) => new Promise<void>((resolve) => {
      if (w.exitCode !== null) return resolve();
      w.once('exit', () => resolve());
      w.kill('SIGTERM');
    })));
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it('gives every OK point, and only those, as aligned columns equal to the points page', async () => {
    const res = await member.get(`/api/scans/${scanId}/plane`);
    expect(res.status).toBe(200);
    const plane = scanPlaneSchema.parse(res.body);
    expect(plane.okPoints).toBe(okPoints.length);
    expect(plane.okPoints).toBeLessThan(30);
    expect(plane.stride).toBe(1);
    expect(plane.axisStrides).toEqual([1, 1]);
    expect(plane.parameters).toEqual(['p', 'nStar']);
    expect(plane.pointIndex).toEqual(okPoints.map((p) => p.pointIndex));
    expect(plane.ns).toEqual(okPoints.map((p) => p.ns));
    expect(plane.r).toEqual(okPoints.map((p) => p.r));
    expect(plane.alphaS).toEqual(okPoints.map((p) => p.alphaS));
    expect(plane.nStar).toEqual(okPoints.map((p) => p.nStar));
    expect(plane.inputs).toEqual({ p: okPoints.map((p) => p.inputs.p), nStar: okPoints.map((p) => p.inputs.nStar) });
    // p = 1 has the e-folds for every N_*, p = 3 for none.
    expect(new Set(plane.inputs.p)).toEqual(new Set([1, 2]));
    expect(plane.inputs.p.filter((p) => p === 1)).toHaveLength(10);
  });

  it('samples the grid evenly as a sub-grid down to the limit, and returns the OK points among the sampled', async () => {
    // 3 values of p × 10 of N_* down to 4 points: every 2nd p and every 5th N_*.
    const res = await member.get(`/api/scans/${scanId}/plane?limit=4`);
    expect(res.status).toBe(200);
    const plane = scanPlaneSchema.parse(res.body);
    expect(plane).toMatchObject({ okPoints: okPoints.length, stride: 10, axisStrides: [2, 5] });
    const kept = okPoints.filter((p) => Math.floor(p.pointIndex / 10) % 2 === 0 && (p.pointIndex % 10) % 5 === 0);
    expect(kept.length).toBeGreaterThan(0);
    expect(plane.pointIndex).toEqual(kept.map((p) => p.pointIndex));
    expect(plane.ns).toEqual(kept.map((p) => p.ns));
    expect(plane.r).toEqual(kept.map((p) => p.r));
    expect(plane.inputs.nStar).toEqual(kept.map((p) => p.inputs.nStar));
    const one = scanPlaneSchema.parse((await member.get(`/api/scans/${scanId}/plane?limit=1`)).body);
    expect(one).toMatchObject({ okPoints: okPoints.length, stride: 30, axisStrides: [3, 10], pointIndex: [0] });
  });

  it('refuses a bad limit, and hides the scan from other groups', async () => {
    for (const limit of ['0', '100001', 'all']) {
      const res = await member.get(`/api/scans/${scanId}/plane?limit=${limit}`);
      expect({ limit, status: res.status }).toEqual({ limit, status: 400 });
      expect(Object.keys(res.body.fieldErrors)).toEqual(['limit']);
    }
    const outsider = await t.signIn(DEMO.tensorMember);
    expect((await outsider.get(`/api/scans/${scanId}/plane`)).status).toBe(404);
    expect((await member.get('/api/scans/999999/plane')).status).toBe(404);
    const viewer = await t.signIn(DEMO.plateauViewer);
    expect((await viewer.get(`/api/scans/${scanId}/plane?limit=2`)).body.pointIndex).toHaveLength(2);
  });

  it('shows the pool: queued chunks before any worker ran, then the workers with their heartbeats', async () => {
    const before = workerPoolSchema.parse(poolBefore);
    expect(before.queue.waiting).toBeGreaterThanOrEqual(scanChunks(scanId, 30, 'slowroll').length);
    const viewer = await t.signIn(DEMO.plateauViewer);
    const ours = (pool: WorkerPool) => pool.workers.filter((w) => workers.some((c) => c.pid === w.pid));
    // A worker writes its heartbeat just after storing a chunk, so the last one may lag a moment.
    const pool = await until(async () => {
      const res = await viewer.get('/api/workers/pool');
      expect(res.status).toBe(200);
      const parsed = workerPoolSchema.parse(res.body);
      return ours(parsed).reduce((n, w) => n + w.pointsDone, 0) >= 30 ? parsed : undefined;
    }, 'the heartbeats to count the scan\'s 30 points', 20_000);
    expect(ours(pool)).toHaveLength(2);
    for (const count of Object.values(pool.queue)) expect(count).toBeGreaterThanOrEqual(0);
    // The same heartbeats as the plain list.
    const listed = (await viewer.get('/api/workers')).body as { id: string }[];
    expect(pool.workers.map((w) => w.id)).toEqual(listed.map((w) => w.id));
    expect((await t.http().get('/api/workers/pool')).status).toBe(401);
  });
});
