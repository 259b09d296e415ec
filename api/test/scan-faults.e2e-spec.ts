import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { pointRequest, RequestEvaluator, ScanGrid, type StoredScanSpec } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';

// Fault tests against the real services: a worker killed with SIGKILL in the middle of a scan.
const WORKER_MAIN = path.resolve('../worker/dist/main.js');

const stop = (w: ChildProcess) => new Promise<void>((resolve) => {
  if (w.exitCode !== null || w.signalCode !== null) return resolve();
  w.once('exit', () => resolve());
  w.kill('SIGTERM');
});

describe('a worker killed mid-scan', () => {
  let t: TestApp;
  let plateauId: number;
  const workers: ChildProcess[] = [];

  beforeAll(async () => {
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '0' });
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  });
  afterAll(async () => {
    await Promise.all(workers.map(stop));
    await t.close();
  });

  it('loses nothing and duplicates nothing: every point once, equal to an undisturbed computation', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const created = await agent.post('/api/scans').send({
      groupId: plateauId, name: 'killed worker', model: { kind: 'family', family: 'starobinsky' },
      axes: [
        { kind: 'range', parameter: 'mu', min: 1e-6, max: 1e-4, count: 20, spacing: 'log' },
        { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 1000, spacing: 'linear' },
      ],
      pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    for (let i = 0; i < 2; i++) workers.push(spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' }));

    // Kill one worker with SIGKILL once work is under way: its chunk is left half-done in bull.
    await until(async () => ((await t.db.getRepository(ScanPoint).countBy({ scanId: id })) >= 2000 ? true : undefined), 'the first chunks');
    workers[0].kill('SIGKILL');

    const done = await until(async () => {
      const res = await agent.get(`/api/scans/${id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the scan to complete after the kill');
    expect(done.progress).toMatchObject({ total: 20_000, done: 20_000, failed: 0 });
    const [{ n, distinct }] = await t.db.query('SELECT COUNT(*) AS n, COUNT(DISTINCT point_index) AS `distinct` FROM scan_points WHERE scan_id = ?', [id]);
    expect(Number(n)).toBe(20_000);
    expect(Number(distinct)).toBe(20_000);

    // The stored results equal those of an undisturbed run (the engine is deterministic).
    const spec = (await t.db.getRepository(Scan).findOneByOrFail({ id })).spec as unknown as StoredScanSpec;
    const grid = new ScanGrid(spec.axes);
    const engine = new RequestEvaluator();
    for (const index of [0, 1999, 2000, 7777, 13_001, 19_999]) {
      const row = await t.db.getRepository(ScanPoint).findOneByOrFail({ scanId: id, pointIndex: index });
      expect(row.ns).toBe(engine.evaluate(pointRequest(spec, 'starobinsky', grid.point(index))).ns);
    }
  });
});
