import { InjectQueue } from '@nestjs/bull';
import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import type { Queue } from 'bull';
import type { DataSource } from 'typeorm';
import {
  REPRODUCE_POINTS_JOB, REPRODUCTION_QUEUE, reproductionJobOptions, type BuildInfo, type CreateReproduction, type ReproducePointsJob, type Reproduction,
  type ReproductionList,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { GroupAccessService } from '../groups/group-access.service';
import { Scan } from '../scans/entities/scan.entity';
import { ScanReproduction } from './entities/scan-reproduction.entity';

/** Checks shown per scan, newest first. */
const LISTED_CHECKS = 20;

/**
 * "Check reproducibility": a random sample of a scan's OK points is chosen and stored here, a worker
 * recomputes it on today's engine through the `scan-reproductions` queue and stores the comparison.
 */
@Injectable()
export class ReproductionsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @InjectQueue(REPRODUCTION_QUEUE) private readonly queue: Queue<ReproducePointsJob>,
    private readonly access: GroupAccessService,
    private readonly audit: AuditService,
    private readonly config: ConfigService,
  ) {}

  /** Samples the scan's OK points (at most `sampleSize`, all of them if it has fewer), stores the check and queues it. */
  async create(user: SessionUser, scanId: number, body: CreateReproduction): Promise<Reproduction> {
    const scan = await this.readable(user, scanId);
    await this.access.require(user, scan.groupId, 'member', 'scan');
    // ORDER BY RAND() reads every OK point's index once: a few MB at 10^6 points, for a rare request.
    const rows: { point_index: number }[] = await this.db.query(
      "SELECT point_index FROM scan_points WHERE scan_id = ? AND status = 'ok' ORDER BY RAND() LIMIT ?",
      [scanId, body.sampleSize],
    );
    if (rows.length === 0) throw new ConflictException('The scan has no OK points to recompute yet');
    const pointIndices = rows.map((r) => Number(r.point_index)).sort((a, b) => a - b);
    const recorded = scan.provenance;
    const saved = await this.db.transaction(async (tx) => {
      const check = await tx.getRepository(ScanReproduction).save({
        scanId, requestedById: user.id, status: 'queued', sampleSize: pointIndices.length, pointIndices,
        scanBuild: recorded ? { engineVersion: recorded.engineVersion, commit: recorded.commit, node: recorded.node } : null,
      });
      await this.audit.record({
        action: 'scan.reproduce', actorId: user.id, groupId: scan.groupId, targetType: 'scan', targetId: scanId, details: { reproductionId: check.id, points: pointIndices.length },
      }, tx);
      return check;
    });
    // After the commit, so the worker finds the row; a lost job is queued again when the check is read.
    await this.enqueue({ scanId, reproductionId: saved.id });
    return this.one(user, scanId, saved.id);
  }

  /** Today's build beside the scan's, and the scan's latest checks. */
  async list(user: SessionUser, scanId: number): Promise<ReproductionList> {
    const scan = await this.readable(user, scanId);
    const rows = await this.db.getRepository(ScanReproduction).find({
      where: { scanId }, relations: { requestedBy: true }, order: { createdAt: 'DESC', id: 'DESC' }, take: LISTED_CHECKS,
    });
    await Promise.all(rows.map((row) => this.requeueIfLost(row)));
    const recorded = scan.provenance;
    return {
      today: this.config.getOrThrow<BuildInfo>('build'),
      scanBuild: recorded ? { engineVersion: recorded.engineVersion, commit: recorded.commit, node: recorded.node } : null,
      items: rows.map(toDto),
    };
  }

  async one(user: SessionUser, scanId: number, id: number): Promise<Reproduction> {
    await this.readable(user, scanId);
    const row = await this.db.getRepository(ScanReproduction).findOne({ where: { id, scanId }, relations: { requestedBy: true } });
    if (!row) throw new NotFoundException('No such reproducibility check of this scan');
    await this.requeueIfLost(row);
    return toDto(row);
  }

  private async readable(user: SessionUser, scanId: number): Promise<Scan> {
    const scan = await this.db.getRepository(Scan).findOneBy({ id: scanId });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    return scan;
  }

  private async enqueue(job: ReproducePointsJob): Promise<void> {
    await this.queue.add(REPRODUCE_POINTS_JOB, job, reproductionJobOptions(job));
  }

  /** MariaDB is the record: a check still open whose job Redis no longer holds (flushed, say) is queued again. */
  private async requeueIfLost(row: ScanReproduction): Promise<void> {
    if (row.status !== 'queued' && row.status !== 'running') return;
    const job = { scanId: row.scanId, reproductionId: row.id };
    const held = await this.queue.getJob(reproductionJobOptions(job).jobId);
    const state = held ? await held.getState() : null;
    if (!held || state === 'completed' || state === 'failed') {
      if (held) await held.remove().catch(() => undefined);
      // Re-read: the worker may have finished it between the two reads.
      const now = await this.db.getRepository(ScanReproduction).findOneBy({ id: row.id });
      if (now && (now.status === 'queued' || now.status === 'running')) await this.enqueue(job);
    }
  }
}

function toDto(row: ScanReproduction): Reproduction {
  return {
    id: row.id, scanId: row.scanId, status: row.status, sampleSize: row.sampleSize, pointIndices: row.pointIndices,
    requestedByName: row.requestedBy?.displayName ?? null, requestedAt: row.createdAt.toISOString(), finishedAt: row.finishedAt?.toISOString() ?? null,
    scanBuild: row.scanBuild, checkedBuild: row.checkedBuild, report: row.report, error: row.error,
  };
}
