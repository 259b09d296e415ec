import { afterAll, afterEach, beforeAll, describe, expect, it } from '@jest/globals';
import Queue from 'bull';
import mysql from 'mysql2/promise';
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import {
  chunkJobOptions, COMPUTE_CHUNK_JOB, pointCount, pointRequest, RequestEvaluator, SCAN_QUEUE, ScanGrid, scanChunks, storedScanSpecSchema, type ComputeChunkJob,
} from '@sixtyfold/shared';
import { eventually } from './support/eventually';

// The worker's own work, without the API: scans written straight into the test MariaDB, their
// chunks put on the queue as the API would, and a real worker process from the build computing
// them. Each chunk's points are stored once, a chunk stored again leaves the counters as they
// were, the last chunk finishes the scan, and a cancelled scan gets nothing written.

const WORKER_MAIN = path.resolve('dist/main.js');

/** Starobinsky slow roll over μ and N_*: 4 × 100 points, two chunks of at most 250 (`chunkSize`), under a millisecond each. */
const spec = (groupId: number, name: string) =>
  storedScanSpecSchema.parse({
    groupId, name, tags: [], note: '', model: { kind: 'family', family: 'starobinsky' }, params: {},
    axes: [
      { kind: 'range', parameter: 'mu', min: 1e-6, max: 1e-4, count: 4, spacing: 'log' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 100, spacing: 'linear' },
    ],
    pivot: { kind: 'fixed' }, method: 'slowroll', potentialSource: 'starobinsky',
  });

interface ScanRow {
  status: string;
  done_points: number;
  failed_points: number;
}


describe('a worker computing chunks from the queue', () => {
  let db: mysql.Connection;
  let queue: Queue.Queue<ComputeChunkJob>;
  let worker: ChildProcess | null = null;
  let owner: { groupId: number; userId: number };

  beforeAll(async () => {
    db = await mysql.createConnection(process.env.DATABASE_URL!);
    queue = new Queue<ComputeChunkJob>(SCAN_QUEUE, process.env.REDIS_URL!);
    const [rows] = await db.query<mysql.RowDataPacket[]>('SELECT group_id, user_id FROM memberships ORDER BY group_id, user_id LIMIT 1');
    owner = { groupId: rows[0].group_id, userId: rows[0].user_id };
  });
  afterEach(async () => {
    if (worker && worker.exitCode === null) {
      const exited = new Promise((resolve) => worker!.once('exit', resolve));
      worker.kill('SIGTERM');
      await exited;
    }
    worker = null;
  });
  afterAll(async () => {
    await db.query("DELETE FROM scans WHERE name LIKE 'worker test:%'");
    await queue.close();
    await db.end();
  });

  /** A queued scan row, as the API stores one. */
  const insertScan = async (name: string, status = 'queued', stored = spec(owner.groupId, `worker test: ${name}`)): Promise<{ id: number; total: number }> => {
    const total = pointCount(stored);
    const [result] = await db.query<mysql.ResultSetHeader>(
      `INSERT INTO scans (group_id, owner_id, family, name, method, status, spec, note, total_points, queued_at)
       VALUES (?, ?, ?, ?, 'slowroll', ?, ?, '', ?, CURRENT_TIMESTAMP(3))`,
      [owner.groupId, owner.userId, stored.potentialSource, stored.name, status, JSON.stringify(stored), total],
    );
    return { id: result.insertId, total };
  };
  const enqueue = (jobs: ComputeChunkJob[]) => queue.addBulk(jobs.map((data) => ({ name: COMPUTE_CHUNK_JOB, data, opts: chunkJobOptions(data) })));
  const scanRow = async (id: number): Promise<ScanRow> => {
    const [rows] = await db.query<mysql.RowDataPacket[]>('SELECT status, done_points, failed_points FROM scans WHERE id = ?', [id]);
    return rows[0] as ScanRow;
  };
  const storedPoints = async (id: number): Promise<number> => {
    const [rows] = await db.query<mysql.RowDataPacket[]>('SELECT COUNT(*) AS n FROM scan_points WHERE scan_id = ?', [id]);
    return Number(rows[0].n);
  };
  const queueEmpty = () =>
    eventually(async () => {
      const counts = await queue.getJobCounts();
      return counts.active + counts.waiting + counts.delayed === 0 ? true : undefined;
    }, 'the queue to empty');
  const startWorker = () => {
    worker = spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' });
  };

  it('stores every point once, finishes the scan with its last chunk, and a chunk stored again changes no counter', async () => {
    const { id, total } = await insertScan('two chunks');
    const chunks = scanChunks(id, total, 'slowroll');
    expect(chunks.length).toBeGreaterThan(1);
    startWorker();
    await enqueue(chunks);
    const finished = await eventually(async () => {
      const row = await scanRow(id);
      return row.status === 'completed' ? row : undefined;
    }, 'the scan to complete');
    expect({ done: finished.done_points, failed: finished.failed_points }).toEqual({ done: 400, failed: 0 });
    expect(await storedPoints(id)).toBe(400);

    // The first chunk once more (a retry after a lost acknowledgement): rows overwritten, counters unchanged.
    await queueEmpty();
    await enqueue([chunks[0]]);
    await queueEmpty();
    const again = await scanRow(id);
    expect({ status: again.status, done: again.done_points, failed: again.failed_points }).toEqual({ status: 'completed', done: 400, failed: 0 });
    expect(await storedPoints(id)).toBe(400);
  });

  it('computes a chunk in the compute order: an N_* axis given first still runs fastest, and each point is what it is alone', async () => {
    // φ^p over N_* (first) × p: the points of one p share a background, so a chunk takes whole p columns.
    const stored = storedScanSpecSchema.parse({
      groupId: owner.groupId, name: 'worker test: N_* first', tags: [], note: '', model: { kind: 'family', family: 'monomial' }, params: { lambda: 1e-10 },
      axes: [
        { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 50, spacing: 'linear' },
        { kind: 'range', parameter: 'p', min: 1, max: 3, count: 8, spacing: 'linear' },
      ],
      pivot: { kind: 'fixed' }, method: 'slowroll', potentialSource: 'monomial', sharedBackgroundAxes: ['nStar'],
    });
    const { id, total } = await insertScan('N_* first', 'queued', stored);
    const chunks = scanChunks(id, total, 'slowroll');
    expect(chunks.map((c) => [c.start, c.end])).toEqual([[0, 250], [250, 400]]);
    startWorker();
    await enqueue([chunks[0]]);
    await queueEmpty();
    // Positions 0–249 are p indices 0–4 at every N_* (index = 8·i_N + i_p).
    const [first] = await db.query<mysql.RowDataPacket[]>('SELECT point_index FROM scan_points WHERE scan_id = ? ORDER BY point_index', [id]);
    const expected = Array.from({ length: 400 }, (_, i) => i).filter((i) => i % 8 < 5);
    expect(first.map((r) => Number(r.point_index))).toEqual(expected);

    await enqueue([chunks[1]]);
    const finished = await eventually(async () => {
      const row = await scanRow(id);
      return row.status === 'completed' ? row : undefined;
    }, 'the scan to complete');
    expect({ done: finished.done_points, failed: finished.failed_points }).toEqual({ done: 400, failed: 0 });
    const [rows] = await db.query<mysql.RowDataPacket[]>('SELECT point_index, inputs, ns, r, a_s FROM scan_points WHERE scan_id = ? ORDER BY point_index', [id]);
    const grid = new ScanGrid(stored.axes!);
    for (const row of rows) {
      const inputs = grid.point(Number(row.point_index));
      expect(row.inputs).toEqual(inputs);
      const alone = new RequestEvaluator().evaluate(pointRequest(stored, 'monomial', inputs));
      // Through MariaDB's DOUBLE and back: the same number to its last digits.
      for (const [stored, computed] of [[row.ns, alone.ns], [row.r, alone.r], [row.a_s, alone.As]]) {
        expect(Math.abs(stored / computed! - 1)).toBeLessThanOrEqual(1e-15);
      }
    }
  });

  it('writes nothing for a cancelled scan', async () => {
    const { id, total } = await insertScan('cancelled', 'cancelled');
    startWorker();
    await enqueue(scanChunks(id, total, 'slowroll'));
    await queueEmpty();
    expect(await storedPoints(id)).toBe(0);
    expect(await scanRow(id)).toMatchObject({ status: 'cancelled', done_points: 0, failed_points: 0 });
  });
});
