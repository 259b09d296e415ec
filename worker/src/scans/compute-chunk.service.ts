import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { axisColumnValues, Scan, ScanPoint, scanLifecycle } from '@sixtyfold/api/database';
import { continuationOf, pointRequest, RequestEvaluator, scanPoints, variedInputs, type ComputeChunkJob } from '@sixtyfold/shared';
import { LOCK_RENEWAL_SECONDS, type WorkerConfig } from '../config/worker.config';

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

/** Points [start, end) of a scan. */
interface PointRange {
  start: number;
  end: number;
}

/**
 * Computes one chunk of a scan with the engine and stores it. The rows are written with one
 * INSERT … ON DUPLICATE KEY UPDATE on (scan_id, point_index), and the scan's counters move by
 * the difference the chunk made, in the same transaction: a retried or duplicated chunk
 * overwrites its rows and leaves the counters right.
 *
 * The engine is synchronous, so while a point computes nothing else in this process runs, bull's
 * lock renewal included. Between points the chunk calls `renew` (which extends its lock)
 * whenever LOCK_RENEWAL_SECONDS have passed; a point ends at its wall-time limit, so the lock is
 * never left unrenewed longer than one point's limit plus that interval, which the config keeps
 * below the lock duration. And after its time slice a chunk stores the points it has and returns
 * the rest as a continuation, so a scan of slow points shares the pool with the others.
 */
@Injectable()
export class ComputeChunkService {
  private readonly logger = new Logger('ComputeChunk');
  private readonly engine: RequestEvaluator;
  private readonly sliceMs: number;

  private readonly pointColumns: { name: string; property: keyof PointRow; primary: boolean; json: boolean }[];

  constructor(@InjectDataSource() private readonly db: DataSource, config: ConfigService) {
    const worker = config.getOrThrow<WorkerConfig>('worker');
    // The engine has no clock of its own; given this one, a point that runs past its wall-time limit ends as budget_exceeded.
    this.engine = new RequestEvaluator({ now: () => performance.now(), budget: { wallTimeMs: worker.pointTimeLimitMs } });
    this.sliceMs = worker.sliceMs;
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
    const parameters = variedInputs(spec);
    const rows: PointRow[] = [];
    const now = new Date();
    const startedAt = performance.now();
    let renewedAt = startedAt;
    let end = job.end;
    for (let i = job.start; i < job.end; i++) {
      const inputs = points.point(i);
      const result = this.engine.evaluate(pointRequest(spec, spec.potentialSource, inputs));
      const ok = result.status === 'ok';
      rows.push({
        scanId: scan.id,
        pointIndex: i,
        inputs,
        ...axisColumnValues(parameters, inputs),
        status: result.status,
        failureReason: ok ? null : result.message.slice(0, 500),
        ns: result.ns,
        r: result.r,
        alphaS: result.alphaS,
        As: result.As,
        amplitudeScale: result.amplitudeScale,
        nTotal: Number.isFinite(result.nTotal) ? result.nTotal : null,
        nStar: result.nStar,
        phiStar: result.phiStar,
        phiEnd: result.phiEnd,
        energyScaleGeV: result.energyScaleGeV,
        computedAt: now,
      });
      if (i + 1 === job.end) break;
      const at = performance.now();
      if (at - startedAt >= this.sliceMs) {
        end = i + 1;
        break;
      }
      if (at - renewedAt >= LOCK_RENEWAL_SECONDS * 1000) {
        await renew((i + 1 - job.start) / (job.end - job.start));
        renewedAt = performance.now();
        // A cancelled scan stops between points, and nothing of this chunk is written.
        if (await this.cancelled(scan.id)) return skipped('cancelled');
      }
    }
    const range = { start: job.start, end };
    const stored = await this.db.transaction((tx) => this.store(tx, scan.id, range, rows));
    if (!stored) return skipped('cancelled');
    this.logger.debug(`scan ${scan.id} chunk ${job.chunk}: points ${range.start}–${range.end - 1} stored`);
    const failed = rows.filter((r) => r.status !== 'ok').length;
    return { scanId: scan.id, chunk: job.chunk, computed: rows.length - failed, failed, rest: end < job.end ? continuationOf(job, end) : undefined };
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
    // The inputs, when the stored spec can be read at all (it may be what made the chunk fail).
    let inputs: (i: number) => Record<string, number> = () => ({});
    let parameters: string[] = [];
    try {
      const spec = (await scans.findOneByOrFail({ id: job.scanId })).spec;
      const points = scanPoints(spec);
      inputs = (i) => points.point(i);
      parameters = variedInputs(spec);
    } catch {
      // Stored without inputs; the reason says what went wrong.
    }
    const now = new Date();
    return this.db.transaction(async (tx) => {
      if (!(await scanLifecycle.lockForStore(tx, scan.id))) return 0;
      const present: { point_index: number }[] = await tx.query(
        'SELECT point_index FROM scan_points WHERE scan_id = ? AND point_index >= ? AND point_index < ? FOR UPDATE',
        [scan.id, job.start, job.end],
      );
      const stored = new Set(present.map((p) => Number(p.point_index)));
      let written = 0;
      // One write per run of missing points, each over exactly the range it fills.
      for (let i = job.start; i < job.end; ) {
        if (stored.has(i)) { i++; continue; }
        const rows: PointRow[] = [];
        for (; i < job.end && !stored.has(i); i++) rows.push(failedRow(scan.id, i, parameters, inputs(i), reason, now));
        await this.write(tx, scan.id, { start: rows[0].pointIndex, end: i }, rows);
        written += rows.length;
      }
      return written;
    });
  }

  private async cancelled(scanId: number): Promise<boolean> {
    const row = await this.db.getRepository(Scan).findOne({ where: { id: scanId }, select: { id: true, status: true } });
    return !row || row.status === 'cancelled';
  }

  /** Writes the points of `range` (exactly `rows`) unless the scan was cancelled or deleted meanwhile; false when skipped. */
  private async store(tx: EntityManager, scanId: number, range: PointRange, rows: PointRow[]): Promise<boolean> {
    if (!(await scanLifecycle.lockForStore(tx, scanId))) return false;
    await this.write(tx, scanId, range, rows);
    return true;
  }

  /** Upserts `rows`, which are exactly the points of `range`, and moves the counters by the difference they make (finishing the scan with its last point). Under the scan's lock. */
  private async write(tx: EntityManager, scanId: number, range: PointRange, rows: PointRow[]): Promise<void> {
    // What an earlier attempt stored in this range; after the write the range holds exactly `rows`.
    const [before] = await tx.query(
      `SELECT COALESCE(SUM(status = 'ok'), 0) AS ok, COALESCE(SUM(status <> 'ok'), 0) AS bad
         FROM scan_points WHERE scan_id = ? AND point_index >= ? AND point_index < ? FOR UPDATE`,
      [scanId, range.start, range.end],
    );
    const { sql, parameters } = this.upsert(rows);
    await tx.query(sql, parameters);
    const ok = rows.filter((r) => r.status === 'ok').length;
    await scanLifecycle.store(tx, scanId, { ok: ok - Number(before.ok), failed: rows.length - ok - Number(before.bad) });
  }

  /**
   * One INSERT … ON DUPLICATE KEY UPDATE for the whole chunk, with the columns taken from the
   * entity's metadata. Written out here rather than with the query builder, which spent as long
   * preparing a chunk's statement as MariaDB took to run it (see DEVELOPERS.md).
   */
  private upsert(rows: PointRow[]): { sql: string; parameters: unknown[] } {
    const columns = this.pointColumns;
    const tuple = `(${columns.map(() => '?').join(', ')})`;
    const sql =
      `INSERT INTO scan_points (${columns.map((c) => `\`${c.name}\``).join(', ')}) VALUES ${rows.map(() => tuple).join(', ')}` +
      ` ON DUPLICATE KEY UPDATE ${columns.filter((c) => !c.primary).map((c) => `\`${c.name}\` = VALUES(\`${c.name}\`)`).join(', ')}`;
    const parameters = rows.flatMap((row) => columns.map((c) => (c.json ? JSON.stringify(row[c.property]) : row[c.property])));
    return { sql, parameters };
  }

}

/** The record of a point the workers could not compute. */
function failedRow(scanId: number, pointIndex: number, parameters: string[], inputs: Record<string, number>, reason: string, computedAt: Date): PointRow {
  return {
    scanId, pointIndex, inputs, ...axisColumnValues(parameters, inputs), status: 'chunk_failed', failureReason: reason.slice(0, 500),
    ns: null, r: null, alphaS: null, As: null, amplitudeScale: null, nTotal: null, nStar: null, phiStar: null, phiEnd: null, energyScaleGeV: null,
    computedAt,
  };
}
