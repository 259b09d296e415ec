import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { SchedulerRegistry } from '@nestjs/schedule';
import { IsNull, Not, type DataSource } from 'typeorm';
import { prunableStatusSchema, type PrunableStatus, type RetentionPolicy, type RetentionRun, type StorageReport } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import type { MaintenanceConfig } from '../config/maintenance.config';
import { Group } from '../groups/entities/group.entity';
import { GroupAccessService } from '../groups/group-access.service';
import { ScheduledRunsService } from '../scheduling/scheduled-runs.service';
import { PruneService } from './prune.service';

export const RETENTION_JOB = 'retention';

/** Each group's retention policy, and the nightly run that applies them all. */
@Injectable()
export class RetentionService implements OnModuleInit {
  private readonly logger = new Logger('RetentionService');

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly config: ConfigService,
    private readonly scheduler: SchedulerRegistry,
    private readonly access: GroupAccessService,
    private readonly audit: AuditService,
    private readonly prune: PruneService,
    private readonly runs: ScheduledRunsService,
  ) {}

  // The time comes from configuration, so the job is registered here rather than with @Cron;
  // with several API processes, each night's run happens in one of them.
  onModuleInit(): void {
    const { retentionCron, retentionTimeZone } = this.config.getOrThrow<MaintenanceConfig>('maintenance');
    const job = this.runs.cron(RETENTION_JOB, retentionCron, retentionTimeZone, () =>
      this.applyAll().then(
        (run) => this.logger.log(`retention run: ${run.groups.map((g) => `group ${g.groupId} ${g.deleted} scans`).join(', ') || 'no policies'}`),
        (err: Error) => this.logger.error(`retention run failed: ${err.stack ?? err.message}`),
      ),
    );
    this.scheduler.addCronJob(RETENTION_JOB, job);
  }

  schedule(): StorageReport['retention'] {
    const { retentionCron } = this.config.getOrThrow<MaintenanceConfig>('maintenance');
    const job = this.scheduler.doesExist('cron', RETENTION_JOB) ? this.scheduler.getCronJob(RETENTION_JOB) : null;
    const next = job?.nextDate();
    return { cron: retentionCron, nextRunAt: next ? next.toJSDate().toISOString() : null };
  }

  /** What the nightly job runs: every group with a policy, pruned by the same service as a person's prune. */
  async applyAll(): Promise<RetentionRun> {
    const groups = await this.db.getRepository(Group).find({ where: { retentionDays: Not(IsNull()) }, order: { id: 'ASC' } });
    const run: RetentionRun = { groups: [] };
    for (const g of groups) {
      const policy = policyOf(g);
      const result = await this.prune.pruneUnattended(
        { groupId: g.id, olderThanDays: policy.keepDays!, ageBasis: 'finished', statuses: policy.statuses },
        'retention',
      );
      run.groups.push({ groupId: g.id, deleted: result.deleted.length });
    }
    return run;
  }

  async get(user: SessionUser, groupId: number): Promise<RetentionPolicy> {
    await this.access.require(user, groupId, 'viewer');
    return policyOf(await this.db.getRepository(Group).findOneByOrFail({ id: groupId }));
  }

  async set(user: SessionUser, groupId: number, policy: RetentionPolicy): Promise<RetentionPolicy> {
    await this.access.require(user, groupId, 'lead');
    return this.db.transaction(async (tx) => {
      const repo = tx.getRepository(Group);
      const before = policyOf(await repo.findOneByOrFail({ id: groupId }));
      const statuses = [...new Set(policy.statuses)].sort();
      await repo.update({ id: groupId }, { retentionDays: policy.keepDays, retentionStatuses: statuses.join(',') });
      const after = { keepDays: policy.keepDays, statuses };
      await this.audit.record({ action: 'group.retention_change', actorId: user.id, groupId, targetType: 'group', targetId: groupId, details: { before, after } }, tx);
      return after;
    });
  }
}

function policyOf(g: Group): RetentionPolicy {
  const statuses = g.retentionStatuses.split(',').filter((s): s is PrunableStatus => prunableStatusSchema.safeParse(s).success);
  return { keepDays: g.retentionDays, statuses };
}
