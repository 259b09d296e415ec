import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn, type ChildProcess } from 'node:child_process';
import { chunkSize, pointRequest, RequestEvaluator, roundForSlice, ScanGrid, scanChunks, type StoredScanSpec } from '@sixtyfold/shared';
import { readRedisConfig } from '../src/config/redis.config';
import { Group } from '../src/groups/entities/group.entity';
import { createRedisClient } from '../src/redis/redis-client';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers, WORKER_MAIN } from './support/workers';

// The whole path: POST /api/scans → MariaDB row → bull jobs in Redis → two real worker
// processes (the built worker) → scan_points → GET /api/scans/:id.

describe('a scan through queue and workers', () => {
  let t: TestApp;
  let plateauId: number;
  let workers: ChildProcess[] = [];

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    workers = startWorkers(2);
  });
  afterAll(async () => {
    await stopWorkers(workers);
    await t.close();
  });

  const spec = (groupId: number) => ({
    groupId,
    name: 'natural inflation over f and N_*',
    tags: ['pipeline-test'],
    model: { kind: 'family', family: 'natural' },
    params: {},
    axes: [
      { kind: 'list', parameter: 'f', values: [5, 7, 10] },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 3, spacing: 'linear' },
    ],
    pivot: { kind: 'fixed' },
    method: 'slowroll',
  });

  it('computes every point once and the stored results equal the engine run directly', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const created = await agent.post('/api/scans').send(spec(plateauId));
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ status: 'queued', totalPoints: 9, donePoints: 0, tags: ['pipeline-test'] });
    const id = created.body.id as number;

    const done = await until(async () => {
      const res = await agent.get(`/api/scans/${id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the scan to complete');
    expect(done).toMatchObject({ totalPoints: 9, donePoints: 9, failedPoints: 0 });
    expect(done.finishedAt).not.toBeNull();

    const rows = await t.db.getRepository(ScanPoint).find({ where: { scanId: id }, order: { pointIndex: 'ASC' } });
    expect(rows.map((r) => r.pointIndex)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8]);
    // The worker sets the axis columns from the varied inputs, in axis order (f, then N_*).
    expect(rows.map((r) => [r.axis0, r.axis1, r.axis2, r.axis3])).toEqual(rows.map((r) => [r.inputs.f, r.inputs.nStar, null, null]));
    const stored = (await t.db.getRepository(Scan).findOneByOrFail({ id })).spec as unknown as StoredScanSpec;
    expect(stored.params).toEqual({ Lambda: 5e-3 }); // the family default filled in
    const grid = new ScanGrid(stored.axes!);
    const engine = new RequestEvaluator();
    for (const row of rows) {
      const direct = engine.evaluate(pointRequest(stored, 'natural', grid.point(row.pointIndex)));
      expect(row.inputs).toEqual(grid.point(row.pointIndex));
      expect(row.status).toBe('ok');
      expect(row.ns).toBe(direct.ns);
      expect(row.r).toBe(direct.r);
      expect(row.nStar).toBe(direct.nStar);
    }

    // Results: a page sorted by n_s, a range filter, the streamed exports and a heatmap slice.
    const page = await agent.get(`/api/scans/${id}/points?sort=ns&order=desc&pageSize=4`);
    expect(page.status).toBe(200);
    expect(page.body.total).toBe(9);
    const nsDesc = [...rows.map((r) => r.ns!)].sort((a, b) => b - a);
    expect(page.body.items.map((p: { ns: number }) => p.ns)).toEqual(nsDesc.slice(0, 4));
    const inRange = await agent.get(`/api/scans/${id}/points?ns_min=0.96&ns_max=0.965`);
    expect(inRange.body.total).toBe(rows.filter((r) => r.ns! >= 0.96 && r.ns! <= 0.965).length);
    expect((await agent.get(`/api/scans/${id}/points?ns_min=abc`)).status).toBe(400);
    // Any column: sorted by an axis input (f descending, ties by point index descending too) and filtered on another.
    const byInput = await agent.get(`/api/scans/${id}/points?sort=input.f&order=desc&input.nStar_min=55&pageSize=10`);
    expect(byInput.status).toBe(200);
    expect(byInput.body.items.map((p: { pointIndex: number }) => p.pointIndex)).toEqual([8, 7, 5, 4, 2, 1]);
    expect(byInput.body.total).toBe(6);
    const csvFiltered = await agent.get(`/api/scans/${id}/points?format=csv&input.f_max=5&sort=r`);
    const filteredRows = csvFiltered.text.trim().split('\n').filter((l) => !l.startsWith('#')).slice(1).map((l) => l.split(','));
    expect(filteredRows.map((cols) => Number(cols[1]))).toEqual([5, 5, 5]);
    expect(filteredRows.map((cols) => Number(cols[6]))).toEqual(rows.slice(0, 3).map((r) => r.r!).sort((a, b) => a - b));
    const unknownAxis = await agent.get(`/api/scans/${id}/points?sort=input.lambda`);
    expect(unknownAxis.status).toBe(400);
    expect(unknownAxis.body.message).toMatch(/no axis lambda; its axes are f, nStar/);
    expect((await agent.get(`/api/scans/${id}/points?sort=input.1bad`)).status).toBe(400);

    const csv = await agent.get(`/api/scans/${id}/points?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const lines = csv.text.trim().split('\n').filter((l) => !l.startsWith('#'));
    expect(lines[0]).toBe('pointIndex,f,nStar,status,failureReason,ns,r,alphaS,As,amplitudeScale,nTotal,phiStar,phiEnd,energyScaleGeV');
    expect(lines).toHaveLength(10);
    const first = lines[1].split(',');
    expect(Number(first[0])).toBe(0);
    expect(Number(first[5])).toBe(rows[0].ns);
    const json = await agent.get(`/api/scans/${id}/points?format=json&status=ok`).buffer(true).parse((res, cb) => {
      let text = '';
      res.on('data', (c: Buffer) => (text += c.toString()));
      res.on('end', () => cb(null, text));
    });
    const exported = JSON.parse(json.body as string);
    expect(exported).toHaveLength(9);
    expect(exported[8]).toMatchObject({ pointIndex: 8, status: 'ok', ns: rows[8].ns });

    const heat = await agent.get(`/api/scans/${id}/grid?x=nStar&y=f&output=r`);
    expect(heat.status).toBe(200);
    expect(heat.body.x).toEqual({ parameter: 'nStar', length: 3, from: 0, to: 2, block: 1, values: [50, 55, 60] });
    expect(heat.body.y).toEqual({ parameter: 'f', length: 3, from: 0, to: 2, block: 1, values: [5, 7, 10] });
    // Cell (ix, iy), row-major at iy*3 + ix, is point (f index iy, nStar index ix) = iy*3 + ix; to 7 significant digits.
    expect(heat.body.mean[2 * 3 + 1]).toBe(roundForSlice(rows[7].r!));
    expect((await agent.get(`/api/scans/${id}/grid?x=nStar&y=g`)).body.fieldErrors.y[0]).toMatch(/no axis g; it has f, nStar/);
  });

  it('the two workers share the chunks of one scan', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const before = new Map<number, number>(((await agent.get('/api/workers')).body as { pid: number; chunksDone: number }[]).map((w) => [w.pid, w.chunksDone]));
    const created = await agent.post('/api/scans').send({ ...spec(plateauId), name: 'shared by the pool', axes: [
      { kind: 'range', parameter: 'f', min: 5, max: 20, count: 80, spacing: 'linear' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 100, spacing: 'linear' },
    ] });
    expect(created.body.totalPoints).toBe(8000);
    await until(async () => {
      const res = await agent.get(`/api/scans/${created.body.id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the scan to complete');
    // Heartbeats are written after each chunk, so the pool view is current.
    const pool = (await agent.get('/api/workers')).body as { pid: number; chunksDone: number }[];
    const mine = pool.filter((w) => workers.some((c) => c.pid === w.pid));
    expect(mine).toHaveLength(2);
    const gained = mine.map((w) => w.chunksDone - (before.get(w.pid) ?? 0));
    expect(gained.reduce((a, b) => a + b, 0)).toBe(scanChunks(created.body.id, 8000, 'slowroll').length);
    expect(Math.min(...gained)).toBeGreaterThanOrEqual(1);
    expect(await t.db.getRepository(ScanPoint).countBy({ scanId: created.body.id })).toBe(8000);
  });

  it('finishes as failed when not one point gave a spectrum, and a retry runs it again', async () => {
    const agent = await t.signIn(DEMO.plateauLead);
    // φ² from φ_init = 16 gives about 63.5 e-folds (common practice: N ≈ φ²/4 − 1/2), so both points lack e-folds.
    const created = await agent.post('/api/scans').send({ ...spec(plateauId), name: 'no point inflates long enough',
      model: { kind: 'family', family: 'monomial' }, phiInit: 16, axes: [{ kind: 'list', parameter: 'nStar', values: [90, 95] }] });
    expect(created.status).toBe(201);
    const finished = await until(async () => {
      const res = await agent.get(`/api/scans/${created.body.id}`);
      return ['completed', 'failed'].includes(res.body.status) ? res.body : undefined;
    }, 'the scan to finish');
    expect(finished).toMatchObject({ status: 'failed', donePoints: 0, failedPoints: 2 });
    expect(finished.finishedAt).not.toBeNull();

    const retried = await agent.post(`/api/scans/${created.body.id}/retry`).send({});
    expect(retried.status).toBe(200);
    expect(retried.body).toMatchObject({ status: 'running', failedPoints: 0 });
    const again = await until(async () => {
      const res = await agent.get(`/api/scans/${created.body.id}`);
      return res.body.status === 'failed' ? res.body : undefined;
    }, 'the retried scan to fail again');
    expect(again).toMatchObject({ donePoints: 0, failedPoints: 2 });
  });

  it('records point failures as data with their reason', async () => {
    const agent = await t.signIn(DEMO.plateauLead);
    const body = { ...spec(plateauId), name: 'some points lack e-folds', model: { kind: 'family', family: 'monomial' }, phiInit: 16,
      axes: [{ kind: 'list', parameter: 'nStar', values: [50, 90] }] };
    const created = await agent.post('/api/scans').send(body);
    expect(created.status).toBe(201);
    const done = await until(async () => {
      const res = await agent.get(`/api/scans/${created.body.id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the scan to complete');
    expect(done).toMatchObject({ donePoints: 1, failedPoints: 1 });
    const heat = await agent.get(`/api/scans/${created.body.id}/grid?x=nStar&y=nStar`);
    expect(heat.status).toBe(400);
    const failures = await agent.get(`/api/scans/${created.body.id}/points?status=failed`);
    expect(failures.body.items.map((p: { pointIndex: number }) => p.pointIndex)).toEqual([1]);
    const failed = await t.db.getRepository(ScanPoint).findOneByOrFail({ scanId: created.body.id, pointIndex: 1 });
    expect(failed.status).toBe('insufficient_efolds');
    expect(failed.failureReason).toMatch(/fewer than N_\* = 90/);
    expect(failed.ns).toBeNull();

    // Retrying recomputes the failed point (the engine is deterministic: it fails again), and
    // the counters stay right because a chunk's rows are overwritten, not added.
    const retried = await agent.post(`/api/scans/${created.body.id}/retry`).send({});
    expect(retried.status).toBe(200);
    const again = await until(async () => {
      const res = await agent.get(`/api/scans/${created.body.id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the retried scan to complete');
    expect(again).toMatchObject({ donePoints: 1, failedPoints: 1 });
    expect(await t.db.getRepository(ScanPoint).countBy({ scanId: created.body.id })).toBe(2);

    const clone = await agent.post(`/api/scans/${created.body.id}/clone`).send({});
    expect(clone.status).toBe(201);
    expect(clone.body).toMatchObject({ status: 'draft', name: 'Copy of some points lack e-folds', totalPoints: 2, donePoints: 0 });
    expect(clone.body.spec).toEqual(again.spec);
  });

  it('refuses what cannot run, saying why', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const tooBig = await member.post('/api/scans').send({ ...spec(plateauId), axes: [
      { kind: 'range', parameter: 'f', min: 1, max: 10, count: 1000, spacing: 'linear' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 1001, spacing: 'linear' },
    ] });
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.message).toBe("This scan has 1,001,000 points, 1,000 more than Plateau Models's limit of 1,000,000");
    const unknown = await member.post('/api/scans').send({ ...spec(plateauId), params: { g: 1 } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fieldErrors['params.g'][0]).toMatch(/no parameter g; it has Lambda, f/);
    const noFamily = await member.post('/api/scans').send({ ...spec(plateauId), model: { kind: 'family', family: 'quintessence' } });
    expect(noFamily.status).toBe(400);
    const badAxis = await member.post('/api/scans').send({ ...spec(plateauId), axes: [] });
    expect(badAxis.status).toBe(400);
    expect(badAxis.body.fieldErrors.axes).toEqual(['add at least one axis']);

    const viewer = await t.signIn(DEMO.plateauViewer);
    expect((await viewer.post('/api/scans').send(spec(plateauId))).status).toBe(403);
    const outsider = await t.signIn(DEMO.tensorMember);
    expect((await outsider.post('/api/scans').send(spec(plateauId))).status).toBe(404);
  });
});

describe('cancelling, deleting and recovering scans', () => {
  let t: TestApp;
  let plateauId: number;
  beforeAll(async () => {
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '0' });
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  });
  afterAll(() => t.close());

  const exactScan = (groupId: number, name: string) => ({
    groupId, name, model: { kind: 'family', family: 'starobinsky' },
    axes: [{ kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 600, spacing: 'linear' }],
    pivot: { kind: 'fixed' }, method: 'exact',
  });

  it('a cancelled scan leaves the queue and writes no new points; its deletion is on record', async () => {
    // No worker runs here: the chunks wait in Redis until the cancel removes them.
    const member = await t.signIn(DEMO.plateauMember);
    const created = await member.post('/api/scans').send(exactScan(plateauId, 'to be cancelled'));
    expect(created.status).toBe(201);
    expect(created.body.progress).toMatchObject({ total: 600, done: 0, queued: 600, running: 0 });
    const cancelled = await member.post(`/api/scans/${created.body.id}/cancel`).send({});
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe('cancelled');
    expect(cancelled.body.progress.queued).toBe(0);
    const again = await member.post(`/api/scans/${created.body.id}/cancel`).send({});
    expect(again.status).toBe(409);

    const worker = spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' });
    try {
      await new Promise((r) => setTimeout(r, 3000));
      expect(await t.db.getRepository(ScanPoint).countBy({ scanId: created.body.id })).toBe(0);
    } finally {
      await new Promise<void>((resolve) => { worker.once('exit', () => resolve()); worker.kill('SIGTERM'); });
    }

    const lead = await t.signIn(DEMO.plateauLead);
    expect((await lead.delete(`/api/scans/${created.body.id}`).send({})).status).toBe(204);
    expect(await t.db.getRepository(Scan).countBy({ id: created.body.id })).toBe(0);
    const events = await t.db.query("SELECT actor_id, details FROM audit_events WHERE action = 'scan.delete' AND target_id = ?", [String(created.body.id)]);
    expect(events).toHaveLength(1);
    expect(events[0].details).toMatchObject({ name: 'to be cancelled', points: 600 });
  });

  it('a retry of failed points stays running until every retried chunk is stored, through a reconciliation', async () => {
    // φ_init = 16 gives φ² about 63.5 e-folds, so the points with N_* above that fail, in many chunks.
    const member = await t.signIn(DEMO.plateauMember);
    const created = await member.post('/api/scans').send({
      groupId: plateauId, name: 'retried across chunks', model: { kind: 'family', family: 'monomial' }, phiInit: 16,
      axes: [{ kind: 'range', parameter: 'nStar', min: 50, max: 90, count: 4001, spacing: 'linear' }],
      pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const finish = async (agent: typeof member, what: string) => {
      const worker = spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' });
      try {
        return await until(async () => {
          const res = await agent.get(`/api/scans/${id}`);
          return res.body.status === 'completed' ? res.body : undefined;
        }, what);
      } finally {
        await new Promise<void>((resolve) => { worker.once('exit', () => resolve()); worker.kill('SIGTERM'); });
      }
    };
    const first = await finish(member, 'the first run');
    expect(first.failedPoints).toBeGreaterThan(2000);
    const failedChunks = await t.db.query("SELECT COUNT(DISTINCT FLOOR(point_index / ?)) AS n FROM scan_points WHERE scan_id = ? AND status <> 'ok'", [chunkSize(4001, 'slowroll'), id]);
    expect(Number(failedChunks[0].n)).toBeGreaterThan(2);

    // No worker runs: the retried chunks wait in Redis, and the failed points are missing meanwhile.
    const retried = await member.post(`/api/scans/${id}/retry`).send({});
    expect(retried.status).toBe(200);
    expect(retried.body).toMatchObject({ status: 'running', donePoints: first.donePoints, failedPoints: 0, finishedAt: null });
    expect(retried.body.progress.queued).toBe(first.failedPoints);
    // A restarted API reconciles at start; the scan must not be taken for finished.
    await t.close();
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '0' });
    const agent = await t.signIn(DEMO.plateauMember);
    expect((await agent.get(`/api/scans/${id}`)).body.status).toBe('running');

    const again = await finish(agent, 'the retried run');
    expect(again).toMatchObject({ donePoints: first.donePoints, failedPoints: first.failedPoints });
    expect(await t.db.getRepository(ScanPoint).countBy({ scanId: id })).toBe(4001);
  }, 120_000);

  it('finishes a scan whose queued work Redis lost, once the API reconciles at start', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const created = await member.post('/api/scans').send({ ...exactScan(plateauId, 'survives a flush'), method: 'slowroll' });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    // Redis loses everything (as after a crash without persistence).
    const redis = await createRedisClient(readRedisConfig());
    await redis.flushdb();
    await redis.quit();
    // A restarted API reconciles MariaDB against the (empty) queue and re-queues the chunks.
    await t.close();
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '0' });
    const worker = spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' });
    try {
      const agent = await t.signIn(DEMO.plateauMember);
      const done = await until(async () => {
        const res = await agent.get(`/api/scans/${id}`);
        return res.body.status === 'completed' ? res.body : undefined;
      }, 'the reconciled scan to complete');
      expect(done.progress).toMatchObject({ total: 600, done: 600, failed: 0, queued: 0 });
      expect(await t.db.getRepository(ScanPoint).countBy({ scanId: id })).toBe(600);
    } finally {
      await new Promise<void>((resolve) => { worker.once('exit', () => resolve()); worker.kill('SIGTERM'); });
    }
  });
});
