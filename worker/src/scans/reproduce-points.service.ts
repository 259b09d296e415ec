import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { hostname } from 'node:os';
import { In, type DataSource } from 'typeorm';
import { Scan, ScanPoint, ScanReproduction } from '@sixtyfold/api/database';
import {
  compareReproduction, pointRequest, POINT_OUTPUTS, scanPoints, type BuildInfo, type ReproducePointsJob, type ReproducedPoint,
} from '@sixtyfold/shared';
import { LOCK_RENEWAL_SECONDS, type WorkerConfig } from '../config/worker.config';
import { createPointEngine, storedOutputs } from './point-engine';

export interface ReproductionOutcome {
  reproductionId: number;
  points: number;
  identical?: boolean;
  skipped?: 'missing' | 'finished';
}

/**
 * Recomputes a reproducibility check's sample on this worker's engine, exactly as a chunk computes
 * its points (the same engine settings, the same mapping to stored values), compares each output
 * with what the scan stored, and stores the recomputed points and the report. Rerunning a check
 * (a retry) recomputes and overwrites: it is idempotent.
 */
@Injectable()
export class ReproducePointsService {
  private readonly worker: WorkerConfig;
  private readonly build: BuildInfo & { worker: string };

  constructor(@InjectDataSource() private readonly db: DataSource, config: ConfigService) {
    this.worker = config.getOrThrow<WorkerConfig>('worker');
    this.build = { ...config.getOrThrow<BuildInfo>('build'), worker: `${hostname()}:${process.pid}` };
  }

  /** `renew()` keeps the job's lock; it is called between points every LOCK_RENEWAL_SECONDS. */
  async run(job: ReproducePointsJob, renew: () => Promise<void> = async () => undefined): Promise<ReproductionOutcome> {
    const checks = this.db.getRepository(ScanReproduction);
    const check = await checks.findOneBy({ id: job.reproductionId });
    const scan = check && (await this.db.getRepository(Scan).findOneBy({ id: check.scanId }));
    if (!check || !scan) return { reproductionId: job.reproductionId, points: 0, skipped: 'missing' };
    if (check.status === 'completed' || check.status === 'failed') return { reproductionId: check.id, points: 0, skipped: 'finished' };
    await checks.update({ id: check.id }, { status: 'running' });

    const spec = scan.spec;
    const points = scanPoints(spec);
    // A fresh engine: nothing cached from other work, so the sample is computed as each point alone would be.
    const engine = createPointEngine(this.worker);
    const recomputed: ReproducedPoint[] = [];
    let renewedAt = performance.now();
    for (const pointIndex of check.pointIndices) {
      const result = engine.evaluate(pointRequest(spec, spec.potentialSource, points.point(pointIndex)));
      recomputed.push({ pointIndex, status: result.status, ...storedOutputs(result) });
      if (performance.now() - renewedAt >= LOCK_RENEWAL_SECONDS * 1000) {
        await renew();
        renewedAt = performance.now();
      }
      // Lets a chunk job of this worker (another queue) go on between points.
      await new Promise(setImmediate);
    }
    const rows = await this.db.getRepository(ScanPoint).find({ where: { scanId: scan.id, pointIndex: In(check.pointIndices) } });
    const stored = rows.map((row): ReproducedPoint => {
      const point: ReproducedPoint = { pointIndex: row.pointIndex, status: row.status } as ReproducedPoint;
      for (const output of POINT_OUTPUTS) point[output] = row[output];
      return point;
    });
    const report = compareReproduction(stored, recomputed);
    await checks.update({ id: check.id }, { status: 'completed', recomputed, report, checkedBuild: this.build, finishedAt: new Date(), error: null });
    return { reproductionId: check.id, points: recomputed.length, identical: report.identical };
  }

  /** A check the workers gave up on, with the reason. */
  async fail(job: ReproducePointsJob, reason: string): Promise<void> {
    await this.db.getRepository(ScanReproduction).update(
      { id: job.reproductionId, status: In(['queued', 'running']) },
      { status: 'failed', error: reason.slice(0, 1000), checkedBuild: this.build, finishedAt: new Date() },
    );
  }
}
