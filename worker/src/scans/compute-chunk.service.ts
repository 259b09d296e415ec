import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { escape } from 'mysql2';
import { hostname } from 'node:os';
import type { DataSource, QueryRunner } from 'typeorm';
import { axisColumnValues, Scan, ScanChunkRun, ScanPoint, scanLifecycle } from '@sixtyfold/api/database';
import { computeOrder, continuationOf, pointRequest, RequestEvaluator, scanPoints, variedInputs, type BuildInfo, type ComputeChunkJob, type StoredScanSpec } from '@sixtyfold/shared';
import { LOCK_RENEWAL_SECONDS, type WorkerConfig } from '../config/worker.config';
import { createPointEngine, storedOutputs } from './point-engine';

/** How long a job waits for another job of the same chunk to finish storing it. */
const CHUNK_LOCK_WAIT_SECONDS = 60;
/** Rows per insert while a chunk computes: large enough to cost MariaDB little per row, small enough to overlap the computing. */
const STORE_BATCH_POINTS = 1000;

export interface ChunkOutcome {
  scanId: number;
  chunk: number;
  computed: number;
  failed: number;
  skipped?: 'missing' | 'cancelled';
  /** The rest of the chunk, to go back on the queue: this job's time slice ran out before it. */
  rest?: ComputeChunkJob;
}

type PointRow = Omit<ScanPoint, 'scan'>;

/**
 * Computes one chunk of a scan with the engine and stores it. A chunk is a run of positions in
 * the scan's compute order (`computeOrder`: points sharing a background together), each position
 * one point index. The chunk is stored in one transaction under its own named lock
 * (`underChunkLock`): its rows go to MariaDB in batches while it computes, as upserts on
 * (scan_id, point_index), and at the end the scan's counters move by the difference the chunk made
 * to what was stored before: a retried or duplicated chunk overwrites its rows and leaves the
 * counters right.
 *
 * The engine is synchronous, so while a point computes nothing else in this process runs, bull's
 * lock renewal included. Between points the chunk calls `renew` (which extends its lock)
 * whenever LOCK_RENEWAL_SECONDS have passed; a point ends at its wall-time limit, so the lock is
 * never left unrenewed longer than one point's limit plus that interval, which the config keeps
 * below the lock duration. And after its time slice a chunk commits the points it has and returns
 * the rest as a continuation, so a scan of slow points shares the pool with the others.
 */
@Injectable()
export class ComputeChunkService {
  private readonly logger = new Logger('ComputeChunk');
  private readonly engine: RequestEvaluator;
  private readonly sliceMs: number;
  /** Recorded with every chunk this process stores: the process, its build and its per-point wall-time limit. */
  private readonly runner: Pick<ScanChunkRun, 'worker' | 'engineVersion' | 'commit' | 'node' | 'pointTimeLimitMs'>;

  private readonly pointColumns: { name: string; property: keyof PointRow; primary: boolean; json: boolean }[];

  constructor(@InjectDataSource() private readonly db: DataSource, config: ConfigService) {
    const worker = config.getOrThrow<WorkerConfig>('worker');
    this.engine = createPointEngine(worker);
    this.sliceMs = worker.sliceMs;
    const build = config.getOrThrow<BuildInfo>('build');
    this.runner = { worker: `${hostname()}:${process.pid}`, ...build, pointTimeLimitMs: worker.pointTimeLimitMs };
    this.pointColumns = db.getMetadata(ScanPoint).columns.map((c) => ({
      name: c.databaseName,
      property: c.propertyName as keyof PointRow,
      primary: c.isPrimary,
      json: c.type === 'json',
    }));
  }

  /** `renew(fraction)` keeps the job's lock and reports its progress; it is called between points every LOCK_RENEWAL_SECONDS. */
  async run(job: ComputeChunkJob, renew: (fraction: number) => Promise<void> = async () => undefined): Promise<ChunkOutcome> {
    const skipped = (why: 'missing' | 'cancelled'): ChunkOutcome => ({ scanId: job.scanId, chunk: job.chunk, computed: 0, failed: 0, skipped: why });
    const scan = await this.db.getRepository(Scan).findOneBy({ id: job.scanId });
    if (!scan) return skipped('missing');
    if (scan.status === 'cancelled') return skipped('cancelled');
    await scanLifecycle.start(this.db, scan.id);

    const spec = scan.spec;
    const points = scanPoints(spec);
    const order = computeOrder(spec);
    const parameters = variedInputs(spec);
    const now = new Date();
    const startedAt = performance.now();
    let renewedAt = startedAt;
    const stored = await this.underChunkLock(scan.id, job.chunk, async (tx) => {
      const indices = Array.from({ length: job.end - job.start }, (_, k) => order.pointAt(job.start + k));
      const before = await this.storedStatuses(tx, scan.id, indices);
      // The counters' change: each stored row counted, minus what an earlier attempt had stored for it.
      const change = { ok: 0, failed: 0 };
      const computed = { ok: 0, failed: 0 };
      // Rows go to MariaDB in batches as they are computed, each insert running there while the
      // next batch computes here; all in the chunk's transaction, counted at its end.
      const inserts: Promise<unknown>[] = [];
      let batch: PointRow[] = [];
      const send = async () => {
        const insert = tx.query(this.upsert(batch));
        insert.catch(() => undefined); // awaited below; a failure rolls the chunk back there
        inserts.push(insert);
        batch = [];
        await new Promise(setImmediate); // lets the driver put the statement on the wire before computing on
      };
      let end = job.end;
      for (let position = job.start; position < job.end; position++) {
        const i = order.pointAt(position);
        const row = this.computeRow(scan.id, spec, parameters, i, points.point(i), now);
        batch.push(row);
        const outcome = row.status === 'ok' ? 'ok' : 'failed';
        computed[outcome]++;
        change[outcome]++;
        const was = before.get(i);
        if (was !== undefined) change[was ? 'ok' : 'failed']--;
        if (batch.length >= STORE_BATCH_POINTS) await send();
        if (position + 1 === job.end) break;
        const at = performance.now();
        if (at - startedAt >= this.sliceMs) {
          end = position + 1;
          break;
        }
        if (at - renewedAt >= LOCK_RENEWAL_SECONDS * 1000) {
          await renew((position + 1 - job.start) / (job.end - job.start));
          renewedAt = performance.now();
          // A cancelled scan stops between points, and nothing of this chunk is written.
          if (await this.cancelled(scan.id)) return false;
        }
      }
      if (batch.length > 0) await send();
      await Promise.all(inserts);
      if (!(await this.count(tx, scan.id, change))) return false;
      // The run is on record exactly when its points are: same transaction.
      await tx.manager.getRepository(ScanChunkRun).insert({
        ...this.runner, scanId: scan.id, chunk: job.chunk, start: job.start, end, startedAt: now, finishedAt: new Date(),
      });
      return { end, ...computed };
    });
    if (!stored) return skipped('cancelled');
    this.logger.debug(`scan ${scan.id} chunk ${job.chunk}: positions ${job.start}–${stored.end - 1} stored`);
    return { scanId: scan.id, chunk: job.chunk, computed: stored.ok, failed: stored.failed, rest: stored.end < job.end ? continuationOf(job, stored.end) : undefined };
  }

  /** The stored row of point `i`, computed by the engine. */
  private computeRow(scanId: number, spec: StoredScanSpec, parameters: string[], i: number, inputs: Record<string, number>, computedAt: Date): PointRow {
    const result = this.engine.evaluate(pointRequest(spec, spec.potentialSource, inputs));
    const ok = result.status === 'ok';
    return {
      scanId,
      pointIndex: i,
      inputs,
      ...axisColumnValues(parameters, inputs),
      status: result.status,
      failureReason: ok ? null : result.message.slice(0, 500),
      ...storedOutputs(result),
      computedAt,
    };
  }

  /**
   * The points of a job that the workers gave up on (its attempts used up, or stalled too often),
   * stored as `chunk_failed` with the reason, through the same store: points stored already
   * (by an earlier slice, say) stay as they are, the counters move by the rows added, and the
   * scan completes when they were its last. Returns the number of points written.
   */
  async storeGivenUp(job: ComputeChunkJob, reason: string): Promise<number> {
    const scans = this.db.getRepository(Scan);
    const scan = await scans.findOne({ where: { id: job.scanId }, select: { id: true, status: true } });
    if (!scan || scan.status === 'cancelled') return 0;
    // The inputs and the chunk's points, when the stored spec can be read at all (it may be what
    // made the chunk fail; then the positions are taken as point indices).
    let inputs: (i: number) => Record<string, number> = () => ({});
    let parameters: string[] = [];
    let pointAt = (position: number) => position;
    try {
      const spec = (await scans.findOneByOrFail({ id: job.scanId })).spec;
      const points = scanPoints(spec);
      const order = computeOrder(spec);
      inputs = (i) => points.point(i);
      parameters = variedInputs(spec);
      pointAt = (position) => order.pointAt(position);
    } catch {
      // Stored without inputs; the reason says what went wrong.
    }
    const indices = Array.from({ length: job.end - job.start }, (_, k) => pointAt(job.start + k));
    const now = new Date();
    const written = await this.underChunkLock(scan.id, job.chunk, async (tx) => {
      const stored = await this.storedStatuses(tx, scan.id, indices);
      const rows = indices.filter((i) => !stored.has(i)).map((i) => failedRow(scan.id, i, parameters, inputs(i), reason, now));
      return rows.length === 0 || (await this.write(tx, scan.id, rows)) ? rows.length : false;
    });
    return written || 0;
  }

  private async cancelled(scanId: number): Promise<boolean> {
    const row = await this.db.getRepository(Scan).findOne({ where: { id: scanId }, select: { id: true, status: true } });
    return !row || row.status === 'cancelled';
  }

  /**
   * Runs `work` in a READ COMMITTED transaction holding the chunk's named lock until after the
   * commit: two jobs of one chunk (a stalled one and its retry, a chunk and its continuation) store
   * one after the other and each sees what the other committed, while the chunks of a scan store
   * side by side, each locking only its own rows. `work` answering false rolls back (the scan was
   * cancelled or deleted meanwhile).
   */
  private async underChunkLock<T>(scanId: number, chunk: number, work: (tx: QueryRunner) => Promise<T | false>): Promise<T | false> {
    const runner = this.db.createQueryRunner();
    const lock = `sixtyfold-scan-${scanId}-chunk-${chunk}`;
    try {
      const [{ got }] = await runner.query('SELECT GET_LOCK(?, ?) AS got', [lock, CHUNK_LOCK_WAIT_SECONDS]);
      if (Number(got) !== 1) throw new Error(`chunk ${chunk} of scan ${scanId}: another worker has been storing it for ${CHUNK_LOCK_WAIT_SECONDS} s`);
      await runner.startTransaction('READ COMMITTED');
      try {
        const result = await work(runner);
        if (result === false) await runner.rollbackTransaction();
        else await runner.commitTransaction();
        return result;
      } catch (err) {
        await runner.rollbackTransaction();
        throw err;
      }
    } finally {
      await runner.query('DO RELEASE_LOCK(?)', [lock]).catch(() => undefined); // a lost connection released it already
      await runner.release();
    }
  }

  /** What is stored of these points already: true for an ok row, false for a failure record. */
  private async storedStatuses(tx: QueryRunner, scanId: number, indices: number[]): Promise<Map<number, boolean>> {
    const rows: { point_index: number; ok: number }[] = await tx.query(
      `SELECT point_index, status = 'ok' AS ok FROM scan_points WHERE scan_id = ? AND ${pointsCondition(indices)}`,
      [scanId],
    );
    return new Map(rows.map((r) => [Number(r.point_index), Number(r.ok) === 1]));
  }

  /**
   * Moves the scan's counters by `change` (finishing the scan with its last point), locking its
   * row last and briefly so that chunks insert side by side; false when the scan was cancelled or
   * deleted meanwhile, which rolls the chunk back.
   */
  private async count(tx: QueryRunner, scanId: number, change: { ok: number; failed: number }): Promise<boolean> {
    if (!(await scanLifecycle.lockForStore(tx, scanId))) return false;
    await scanLifecycle.store(tx, scanId, change);
    return true;
  }

  /** Upserts `rows` (failure records of points not stored yet) and counts them. */
  private async write(tx: QueryRunner, scanId: number, rows: PointRow[]): Promise<boolean> {
    await tx.query(this.upsert(rows));
    const ok = rows.filter((r) => r.status === 'ok').length;
    return this.count(tx, scanId, { ok, failed: rows.length - ok });
  }

  /**
   * One INSERT … ON DUPLICATE KEY UPDATE for the whole chunk, with the columns taken from the
   * entity's metadata and the values written as literals: TypeORM's insert builder spent as long
   * preparing a chunk's statement as MariaDB took to run it, and placeholders filled by the driver
   * still cost ~5 µs a point, a third of the engine's own time (see DEVELOPERS.md).
   */
  private upsert(rows: PointRow[]): string {
    const columns = this.pointColumns;
    const values = rows.map((row) => `(${columns.map((c) => sqlLiteral(row[c.property], c.json)).join(', ')})`);
    // Without the foreign-key check, an insert takes no shared lock on the scan's row, which the
    // counter update then needs exclusively: with it, two chunks storing at once deadlock. The scan
    // is checked under its lock after the insert instead (`write`).
    return (
      `SET STATEMENT foreign_key_checks = 0 FOR INSERT INTO scan_points (${columns.map((c) => `\`${c.name}\``).join(', ')}) VALUES ${values.join(', ')}` +
      ` ON DUPLICATE KEY UPDATE ${columns.filter((c) => !c.primary).map((c) => `\`${c.name}\` = VALUES(\`${c.name}\`)`).join(', ')}`
    );
  }
}

/**
 * A value as a MariaDB literal: numbers as JavaScript writes them (the shortest form that reads back
 * to the same double), a number that is not finite or an absent value as NULL, dates in UTC as the
 * connection's `timezone: 'Z'` has them, and strings (JSON for the JSON columns) escaped by the driver.
 */
function sqlLiteral(value: unknown, json: boolean): string {
  if (value === null || value === undefined) return 'NULL';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : 'NULL';
  if (json) return escape(JSON.stringify(value));
  if (value instanceof Date) return escape(value, false, 'Z');
  return escape(String(value));
}

/**
 * The SQL condition on `point_index` for these points (integers, written into the statement): a
 * range when they are consecutive, as in a scan computed in index order, else a list.
 */
function pointsCondition(indices: number[]): string {
  const sorted = [...indices].sort((a, b) => a - b);
  const [first, last] = [sorted[0], sorted[sorted.length - 1]];
  return last - first === sorted.length - 1 ? `point_index BETWEEN ${first} AND ${last}` : `point_index IN (${sorted.join(', ')})`;
}

/** The record of a point the workers could not compute. */
function failedRow(scanId: number, pointIndex: number, parameters: string[], inputs: Record<string, number>, reason: string, computedAt: Date): PointRow {
  return {
    scanId, pointIndex, inputs, ...axisColumnValues(parameters, inputs), status: 'chunk_failed', failureReason: reason.slice(0, 500),
    ns: null, r: null, alphaS: null, As: null, amplitudeScale: null, nTotal: null, nStar: null, phiStar: null, phiEnd: null, energyScaleGeV: null,
    computedAt,
  };
}
