import { Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { completeIfAllStored, Scan, ScanPoint } from '@sixtyfold/api/database';
import { pointRequest, RequestEvaluator, scanPoints, type ComputeChunkJob, type StoredScanSpec } from '@sixtyfold/shared';

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
  // The engine has no clock of its own; given this one, a point that runs past its wall-time budget ends as budget_exceeded.
  private readonly engine = new RequestEvaluator({ now: () => performance.now() });

  private readonly pointColumns: { name: string; property: keyof PointRow; primary: boolean; json: boolean }[];

  constructor(@InjectDataSource() private readonly db: DataSource) {
    this.pointColumns = db.getMetadata(ScanPoint).columns.map((c) => ({
      name: c.databaseName,
      property: c.propertyName as keyof PointRow,
      primary: c.isPrimary,
      json: c.type === 'json',
    }));
  }

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
    const points = scanPoints(spec);
    const rows: PointRow[] = [];
    const now = new Date();
    for (let i = job.start; i < job.end; i++) {
      const inputs = points.point(i);
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
    // The scan row first: every chunk of a scan takes its lock in the same order, and a cancel
    // (which updates this row) is either before this check or after this chunk's commit.
    const [scanRow] = await tx.query('SELECT status FROM scans WHERE id = ? FOR UPDATE', [scanId]);
    if (!scanRow || scanRow.status === 'cancelled') return false;
    // What an earlier attempt of this chunk stored; after the write the range holds exactly `rows`.
    const [before] = await tx.query(
      `SELECT COALESCE(SUM(status = 'ok'), 0) AS ok, COALESCE(SUM(status <> 'ok'), 0) AS bad
         FROM scan_points WHERE scan_id = ? AND point_index >= ? AND point_index < ? FOR UPDATE`,
      [scanId, job.start, job.end],
    );
    const { sql, parameters } = this.upsert(rows);
    await tx.query(sql, parameters);
    const ok = rows.filter((r) => r.status === 'ok').length;
    await tx.query(
      `UPDATE scans SET done_points = done_points + ?, failed_points = failed_points + ? WHERE id = ?`,
      [ok - Number(before.ok), rows.length - ok - Number(before.bad), scanId],
    );
    await completeIfAllStored(tx, scanId);
    this.logger.debug(`scan ${scanId} chunk ${job.chunk}: ${rows.length} points stored`);
    return true;
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
