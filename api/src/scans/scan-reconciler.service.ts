import { Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { scanChunks } from '@sixtyfold/shared';
import { chunkOfPointSql } from './chunk-of-point';
import type { AppConfig } from '../config/app.config';
import { ScheduledRunsService } from '../scheduling/scheduled-runs.service';
import { Scan } from './entities/scan.entity';
import { scanLifecycle } from '../database/scan-lifecycle';
import { ScanQueueService } from './scan-queue.service';

/**
 * MariaDB is the record, Redis only the transport. At start and then periodically, every scan
 * still queued or running gets the chunks whose points are missing and that have no job waiting
 * or running (neither the chunk's own nor a continuation of it) put back on the queue, and a scan
 * whose points are all stored is marked completed. A Redis that lost its data, or jobs that vanished, still finish.
 * The periodic pass runs in one API process per interval; the pass at start runs in each process
 * as it starts (re-queueing is idempotent by job id).
 */
@Injectable()
export class ScanReconcilerService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('ScanReconciler');
  private timer: NodeJS.Timeout | undefined;
  private running = false;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly queue: ScanQueueService,
    private readonly config: ConfigService,
    private readonly runs: ScheduledRunsService,
  ) {}

  onApplicationBootstrap(): void {
    const seconds = this.config.getOrThrow<AppConfig>('app').reconcileIntervalSeconds;
    void this.reconcileAll();
    if (seconds > 0) this.timer = this.runs.every('scan-reconcile', seconds * 1000, () => this.reconcileAll());
  }

  onApplicationShutdown(): void {
    clearInterval(this.timer);
  }

  /** Returns the number of chunks put back on the queue. */
  async reconcileAll(): Promise<number> {
    if (this.running) return 0;
    this.running = true;
    let requeued = 0;
    try {
      // The queue first, then the points: a chunk with no job in this picture stores nothing
      // more, so whatever it has stored by now is in the reads that follow.
      const queued = new Set((await this.queue.liveJobs()).map((job) => `${job.scanId}/${job.chunk}`));
      const live = await this.db.getRepository(Scan).find({ where: [{ status: 'queued' }, { status: 'running' }], select: { id: true, totalPoints: true, method: true, spec: true } });
      for (const scan of live) requeued += await this.reconcile(scan, (chunk) => queued.has(`${scan.id}/${chunk}`));
      if (requeued > 0) this.logger.log(`re-queued ${requeued} chunk(s) of ${live.length} live scan(s)`);
    } catch (err) {
      this.logger.warn(`reconciliation failed, will try again: ${(err as Error).message}`);
    } finally {
      this.running = false;
    }
    return requeued;
  }

  private async reconcile(scan: Pick<Scan, 'id' | 'totalPoints' | 'method' | 'spec'>, queued: (chunk: number) => boolean): Promise<number> {
    const rows: { chunk: string; stored: string }[] = await this.db.query(
      `SELECT ${chunkOfPointSql(scan.spec, scan.totalPoints, scan.method)} AS chunk, COUNT(*) AS stored FROM scan_points WHERE scan_id = ? GROUP BY chunk`,
      [scan.id],
    );
    const stored = new Map(rows.map((r) => [Number(r.chunk), Number(r.stored)]));
    const incomplete = scanChunks(scan.id, scan.totalPoints, scan.method).filter((c) => (stored.get(c.chunk) ?? 0) < c.end - c.start);
    if (incomplete.length === 0) {
      await scanLifecycle.finishIfAllStored(this.db, scan.id);
      return 0;
    }
    // A chunk whose job or continuation is on the queue is on its way; one without is computed
    // again whole (rare: Redis lost its jobs), and the store overwrites what it had.
    const missing = new Set(incomplete.filter((c) => !queued(c.chunk)).map((c) => c.chunk));
    return missing.size === 0 ? 0 : this.queue.enqueue(scan.id, scan.totalPoints, scan.method, missing);
  }
}
