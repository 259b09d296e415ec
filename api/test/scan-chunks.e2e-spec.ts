import { afterAll, afterEach, beforeAll, describe, expect, it } from '@jest/globals';
import Queue from 'bull';
import type { ChildProcess } from 'node:child_process';
import os from 'node:os';
import {
  chunkJobOptions, COMPUTE_CHUNK_JOB, continuationOf, parseChunkJobId, SCAN_QUEUE, WORKER_HEARTBEAT_PREFIX, workerHeartbeatSchema, type ComputeChunkJob,
} from '@sixtyfold/shared';
import { readRedisConfig } from '../src/config/redis.config';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { redisOptions } from '../src/redis/redis-client';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

// How chunks live on the queue, with real workers on the real Redis and MariaDB: a chunk keeps
// its lock however long its points take, a chunk the workers give up on is stored as failed,
// and a slow scan hands its chunk back after each time slice so other scans get the worker.
// The API reconciles every second throughout, so these also show it never queues a chunk twice.

/**
 * A potential whose modulation (period 6e-8 in φ) the integrator can only follow in tiny steps:
 * with c > 0 a point computes until its wall-time limit, with c = 0 it is plain φ² and quick.
 */
const SLOW_MODEL = (groupId: number) => ({
  groupId, name: 'finely modulated quadratic', expression: 'phi^2 * (1 + c * sin(1e8 * phi))',
  parameters: [{ name: 'c', defaultValue: 1e-9, description: 'modulation depth' }], phiInit: 16, description: '',
});
/** Points end at 1 s; the lock (4 s) is shorter than a chunk of these points takes. */
const SLOW_POINTS = { WORKER_POINT_TIME_LIMIT_SECONDS: '1', WORKER_LOCK_SECONDS: '4' };

const slowScan = (groupId: number, modelId: number, name: string, c: number[]) => ({
  groupId, name, model: { kind: 'group', modelId }, params: {},
  axes: [{ kind: 'list', parameter: 'c', values: c }], pivot: { kind: 'fixed', nStar: 55 }, method: 'exact',
});
/** 20 × `count` Starobinsky slow-roll points, milliseconds each. */
const quickScan = (groupId: number, name: string, count: number) => ({
  groupId, name, model: { kind: 'family', family: 'starobinsky' },
  axes: [
    { kind: 'range', parameter: 'mu', min: 1e-6, max: 1e-4, count: 20, spacing: 'log' },
    { kind: 'range', parameter: 'nStar', min: 50, max: 60, count, spacing: 'linear' },
  ],
  pivot: { kind: 'fixed' }, method: 'slowroll',
});

describe('chunks on the queue', () => {
  let t: TestApp;
  let member: Awaited<ReturnType<TestApp['signIn']>>;
  let plateauId: number;
  let slowModelId: number;
  let queue: Queue.Queue<ComputeChunkJob>;
  let workers: ChildProcess[] = [];
  /** Job ids as workers took them, and as bull found them stalled, in order. */
  const taken: string[] = [];
  const stalled: string[] = [];

  beforeAll(async () => {
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '1' });
    // Live scans other suites left in the shared test database would be re-queued by the reconciler and
    // computed by these workers, whose heartbeats count points: they are cancelled first.
    await t.db.query("UPDATE scans SET status = 'cancelled' WHERE status IN ('queued', 'running')");
    member = await t.signIn(DEMO.plateauMember);
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const model = await member.post('/api/models').send(SLOW_MODEL(plateauId));
    expect(model.status).toBe(201);
    slowModelId = model.body.id;
    queue = new Queue<ComputeChunkJob>(SCAN_QUEUE, { redis: redisOptions(readRedisConfig()) });
    const registered = Promise.all(['active', 'stalled'].map((e) => new Promise((r) => queue.once(`registered:global:${e}`, r))));
    queue.on('global:active', (id: string) => taken.push(id));
    queue.on('global:stalled', (id: string) => stalled.push(id));
    await registered;
  });
  afterEach(async () => {
    await stopWorkers(workers);
    workers = [];
  }, 60_000);
  afterAll(async () => {
    await queue.close();
    await t.close();
  });

  const submit = async (body: object): Promise<number> => {
    const res = await member.post('/api/scans').send(body);
    expect(res.status).toBe(201);
    return res.body.id;
  };
  const scan = (id: number) => t.db.getRepository(Scan).findOneByOrFail({ id });
  const finished = (id: number, what: string) =>
    until(async () => {
      const s = await scan(id);
      return s.status === 'completed' || s.status === 'failed' ? s : undefined;
    }, what);
  const jobsOf = (id: number) => taken.filter((job) => parseChunkJobId(job)?.scanId === id);
  /** Points the workers computed, from their heartbeats, once no job is waiting or running. */
  const pointsComputed = async (): Promise<number> => {
    await until(async () => {
      const counts = await queue.getJobCounts();
      return counts.active + counts.waiting + counts.delayed === 0 ? true : undefined;
    }, 'the queue to empty');
    const beats = await Promise.all(workers.map((w) => queue.client.get(`${WORKER_HEARTBEAT_PREFIX}${os.hostname()}:${w.pid}`)));
    return beats.reduce((sum, beat) => sum + (beat ? workerHeartbeatSchema.parse(JSON.parse(beat)).pointsDone : 0), 0);
  };

  it('a chunk that takes longer than its lock lasts is computed once: no stall, no second worker', async () => {
    // 8 points of about a second: twice the lock duration, on two workers that would both take it.
    const id = await submit(slowScan(plateauId, slowModelId, 'longer than the lock', [1e-9, 1.1e-9, 1.2e-9, 1.3e-9, 1.4e-9, 1.5e-9, 1.6e-9, 1.7e-9]));
    workers = startWorkers(2, { ...SLOW_POINTS, WORKER_SLICE_SECONDS: '600' });
    const done = await finished(id, 'the slow chunk to be stored');

    expect(await pointsComputed()).toBe(8);
    expect(jobsOf(id)).toEqual([`scan-${id}-chunk-0`]);
    expect(stalled).toEqual([]);
    // Every point ran to its wall-time limit, so none gave a spectrum.
    expect({ status: done.status, done: done.donePoints, failed: done.failedPoints }).toEqual({ status: 'failed', done: 0, failed: 8 });
    const rows = await t.db.getRepository(ScanPoint).findBy({ scanId: id });
    expect(rows.map((r) => r.status)).toEqual(Array(8).fill('budget_exceeded'));
    expect(rows[0].failureReason).toMatch(/budget of 1 s of computing time ran out/);
  }, 120_000);

  it('a chunk whose attempts are used up is stored as failed, and the scan finishes', async () => {
    // Two chunks of 250 points; MariaDB refuses the second chunk's results (as a full disk or a
    // broken constraint would) but still takes failure records.
    const id = await submit(quickScan(plateauId, 'second chunk refused', 25));
    await t.db.query(
      `CREATE TRIGGER refuse_second_chunk BEFORE INSERT ON scan_points FOR EACH ROW
         IF NEW.scan_id = ${Number(id)} AND NEW.point_index >= 250 AND NEW.status <> 'chunk_failed' THEN
           SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'no space left for these rows';
         END IF`,
    );
    try {
      workers = startWorkers(1);
      const done = await finished(id, 'the scan to finish despite its refused chunk');
      expect({ status: done.status, done: done.donePoints, failed: done.failedPoints }).toEqual({ status: 'completed', done: 250, failed: 250 });
    } finally {
      await t.db.query('DROP TRIGGER IF EXISTS refuse_second_chunk');
    }
    const failed = await t.db.getRepository(ScanPoint).find({ where: { scanId: id, status: 'chunk_failed' }, order: { pointIndex: 'ASC' } });
    expect(failed.map((r) => r.pointIndex)).toEqual(Array.from({ length: 250 }, (_, i) => 250 + i));
    expect(failed[0].failureReason).toBe('the workers could not compute points 250–499: no space left for these rows after 5 attempts');
    // The failure records keep the point's inputs, like any other point.
    expect(Object.keys(failed[0].inputs).sort()).toEqual(['mu', 'nStar']);

    // Five attempts of the refused chunk, one of the other; the reconciler, every second
    // throughout, queued neither again, and leaves the finished scan alone.
    expect(jobsOf(id).sort()).toEqual([`scan-${id}-chunk-0`, ...Array(5).fill(`scan-${id}-chunk-1`)]);
    await new Promise((r) => setTimeout(r, 2500));
    const queued = await queue.getJobs(['waiting', 'delayed', 'active']);
    expect(queued.filter((job) => job?.data.scanId === id)).toEqual([]);
    expect(jobsOf(id)).toHaveLength(6);
  }, 120_000);

  it('one slow scan does not keep the worker from another: its chunk goes back after each slice', async () => {
    // Scan A: one chunk of a quick point and eleven of about a second; slices of 3 s.
    const slowIds = [0, 1e-9, 1.1e-9, 1.2e-9, 1.3e-9, 1.4e-9, 1.5e-9, 1.6e-9, 1.7e-9, 1.8e-9, 1.9e-9, 2e-9];
    const a = await submit(slowScan(plateauId, slowModelId, 'slow scan', slowIds));
    workers = startWorkers(1, { ...SLOW_POINTS, WORKER_SLICE_SECONDS: '3' });
    await until(async () => ((await scan(a)).status === 'running' ? true : undefined), 'the slow scan to start');
    // Scan B, submitted while the only worker computes A's chunk.
    const b = await submit(quickScan(plateauId, 'quick scan', 2));

    const bDone = await finished(b, 'the quick scan to finish');
    const aMeanwhile = await scan(a);
    expect(bDone.status).toBe('completed');
    expect(aMeanwhile.status).toBe('running');
    expect(aMeanwhile.donePoints + aMeanwhile.failedPoints).toBeLessThan(slowIds.length);

    const aDone = await finished(a, 'the slow scan to finish');
    expect({ status: aDone.status, done: aDone.donePoints, failed: aDone.failedPoints }).toEqual({ status: 'completed', done: 1, failed: 11 });
    const rows = await t.db.getRepository(ScanPoint).find({ where: { scanId: a }, order: { pointIndex: 'ASC' } });
    expect(rows.map((r) => r.pointIndex)).toEqual(slowIds.map((_, i) => i));
    expect(rows[0].status).toBe('ok');
    // A's chunk ran as its first job and continuations, each from where the last slice stopped,
    // and no point twice: not by a retry, nor by the reconciler queueing the chunk again.
    const jobs = jobsOf(a).map((job) => parseChunkJobId(job)!);
    expect(jobs[0]).toEqual({ scanId: a, chunk: 0, from: null });
    expect(jobs.length).toBeGreaterThan(2);
    const starts = jobs.slice(1).map((job) => job.from!);
    expect([...starts].sort((x, y) => x - y)).toEqual(starts);
    expect(new Set(starts).size).toBe(starts.length);
    expect(jobsOf(b).length).toBeGreaterThan(0);
    expect(taken.indexOf(jobsOf(b)[0])).toBeLessThan(taken.indexOf(jobsOf(a).at(-1)!));
    expect(await pointsComputed()).toBe(slowIds.length + 40);
    expect(stalled).toEqual([]);
  }, 180_000);

  it('a continuation counts as the rest of its chunk, keeps the reconciler from queueing the chunk again, and leaves with a cancel', async () => {
    // No worker runs: this test takes the jobs itself, as a worker would, and hands one on.
    const id = await submit(quickScan(plateauId, 'continuation bookkeeping', 25)); // chunks 0–249 and 250–499
    const take = async () => {
      const job = await queue.getNextJob();
      if (!job) throw new Error('no chunk waiting');
      expect(job.data.scanId).toBe(id);
      return job;
    };
    const handOn = async (job: Queue.Job<ComputeChunkJob>, from: number) => {
      const rest = continuationOf(job.data, from);
      await queue.add(COMPUTE_CHUNK_JOB, rest, chunkJobOptions(rest));
      await job.moveToCompleted('sliced', true, true);
    };
    const waiting = async () => (await queue.getJobs(['waiting', 'delayed'])).filter((job) => job?.data.scanId === id).map((job) => job.id);

    await handOn(await take(), 100);
    // The second chunk goes first (priority 3): the continuation waits behind it.
    const second = await take();
    expect(second.id).toBe(`scan-${id}-chunk-1`);
    const rest = await take();
    expect(rest.id).toBe(`scan-${id}-chunk-0-from-100`);
    const progress = (await member.get(`/api/scans/${id}`)).body.progress;
    expect({ running: progress.running, queued: progress.queued }).toEqual({ running: 250 + 150, queued: 100 });

    // The reconciler passes every second; chunk 0 is missing points, but its continuation runs.
    await new Promise((r) => setTimeout(r, 2500));
    expect(await waiting()).toEqual([]);

    await handOn(rest, 180);
    expect(await waiting()).toEqual([`scan-${id}-chunk-0-from-180`]);
    await new Promise((r) => setTimeout(r, 2500));
    expect(await waiting()).toEqual([`scan-${id}-chunk-0-from-180`]);
    expect((await member.post(`/api/scans/${id}/cancel`).send({})).status).toBe(200);
    expect(await waiting()).toEqual([]);
    await second.moveToCompleted('cancelled', true, true);
  }, 60_000);
});
