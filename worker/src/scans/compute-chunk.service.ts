import { Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { completeIfAllStored, Scan, ScanPoint } from '@sixtyfold/api/database';
import { pointRequest, RequestEvaluator, ScanGrid, type ComputeChunkJob, type StoredScanSpec } from '@sixtyfold/shared';

export interface ChunkOutcome {
  scanId: number;
  chunk: number;
  computed: number;
  failed: number;
  skipped?: 'missing' | 'cancelled';
}

type PointRow = Omit<ScanPoint, 'scan'>;

/**
 * Computes one chunk of a scan with the engine and stores it. The rows are written with one
 * INSERT … ON DUPLICATE KEY UPDATE on (scan_id, point_index), and the scan's counters move by
 * the difference the chunk made, in the same transaction: a retried or duplicated chunk
 * overwrites its rows and leaves the counters right.
 */
@Injectable()
export class ComputeChunkService {
  private readonly logger = new Logger('ComputeChunk');
  private readonly engine = new RequestEvaluator();

  constructor(@InjectDataSource() private readonly db: DataSource) {}

  async run(job: ComputeChunkJob, progress: (fraction: number) => Promise<void> | void = () => undefined): Promise<ChunkOutcome> {
    const scan = await this.db.getRepository(Scan).findOneBy({ id: job.scanId });
    if (!scan) return { scanId: job.scanId, chunk: job.chunk, computed: 0, failed: 0, skipped: 'missing' };
    if (scan.status === 'cancelled') return { scanId: job.scanId, chunk: job.chunk, computed: 0, failed: 0, skipped: 'cancelled' };
    await this.db
      .createQueryBuilder()
      .update(Scan)
      .set({ status: 'running', startedAt: () => 'CURRENT_TIMESTAMP(3)' })
      .where('id = :id AND status = :queued', { id: scan.id, queued: 'queued' })
      .execute();

    const spec = scan.spec as unknown as StoredScanSpec;
    const grid = new ScanGrid(spec.axes);
    const rows: PointRow[] = [];
    const now = new Date();
    for (let i = job.start; i < job.end; i++) {
      const inputs = grid.point(i);
      const result = this.engine.evaluate(pointRequest(spec, spec.potentialSource, inputs));
      const ok = result.status === 'ok';
      rows.push({
        scanId: scan.id,
        pointIndex: i,
        inputs,
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
      if ((i - job.start) % 250 === 249) {
        await progress((i - job.start + 1) / (job.end - job.start));
        // A cancelled scan stops between points, and nothing of this chunk is written.
        if (await this.cancelled(scan.id)) return { scanId: scan.id, chunk: job.chunk, computed: 0, failed: 0, skipped: 'cancelled' };
      }
    }
    const stored = await this.db.transaction((tx) => this.store(tx, scan.id, job, rows));
    if (!stored) return { scanId: scan.id, chunk: job.chunk, computed: 0, failed: 0, skipped: 'cancelled' };
    const failed = rows.filter((r) => r.status !== 'ok').length;
    return { scanId: scan.id, chunk: job.chunk, computed: rows.length - failed, failed };
  }

  private async cancelled(scanId: number): Promise<boolean> {
    const row = await this.db.getRepository(Scan).findOne({ where: { id: scanId }, select: { id: true, status: true } });
    return !row || row.status === 'cancelled';
  }

  /** Writes the chunk unless the scan was cancelled or deleted meanwhile; false when skipped. */
  private async store(tx: EntityManager, scanId: number, job: ComputeChunkJob, rows: PointRow[]): Promise<boolean> {
    const counts = async () => {
      const [row] = await tx.query(
        `SELECT COALESCE(SUM(status = 'ok'), 0) AS ok, COALESCE(SUM(status <> 'ok'), 0) AS bad
           FROM scan_points WHERE scan_id = ? AND point_index >= ? AND point_index < ? FOR UPDATE`,
        [scanId, job.start, job.end],
      );
      return { ok: Number(row.ok), bad: Number(row.bad) };
    };
    // The scan row first: every chunk of a scan takes its lock in the same order, and a cancel
    // (which updates this row) is either before this check or after this chunk's commit.
    const [scanRow] = await tx.query('SELECT status FROM scans WHERE id = ? FOR UPDATE', [scanId]);
    if (!scanRow || scanRow.status === 'cancelled') return false;
    const before = await counts();
    await tx
      .createQueryBuilder()
      .insert()
      .into(ScanPoint)
      .values(rows)
      .orUpdate(
        ['inputs', 'status', 'failure_reason', 'ns', 'r', 'alpha_s', 'a_s', 'amplitude_scale', 'n_total', 'n_star', 'phi_star', 'phi_end', 'energy_scale_gev', 'computed_at'],
        ['scan_id', 'point_index'],
      )
      .execute();
    const after = await counts();
    await tx.query(
      `UPDATE scans SET done_points = done_points + ?, failed_points = failed_points + ? WHERE id = ?`,
      [after.ok - before.ok, after.bad - before.bad, scanId],
    );
    await completeIfAllStored(tx, scanId);
    this.logger.debug(`scan ${scanId} chunk ${job.chunk}: ${rows.length} points stored`);
    return true;
  }
}
