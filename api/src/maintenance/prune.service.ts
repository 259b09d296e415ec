import { BadRequestException, ConflictException, ForbiddenException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { PRUNABLE_STATUSES, type PruneFilter, type PrunePlan, type PrunePlanItem, type PruneRequest, type PruneResult } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { GroupAccessService } from '../groups/group-access.service';
import { Scan } from '../scans/entities/scan.entity';
import { MaintenanceAccessService } from './maintenance-access.service';
import { ScanDeletionService, type DeletionReason } from './scan-deletion.service';
import { StorageService } from './storage.service';

/** Selecting scans by a filter, listing exactly what a prune would delete, and deleting exactly that. */
@Injectable()
export class PruneService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly maintenanceAccess: MaintenanceAccessService,
    private readonly storage: StorageService,
    private readonly deletion: ScanDeletionService,
  ) {}

  /** The dry run: every scan the filter selects now, with its points and bytes. */
  async plan(user: SessionUser, filter: PruneFilter): Promise<PrunePlan> {
    await this.requireMayPrune(user, filter);
    return this.planFor(filter);
  }

  /**
   * Deletes the scans the filter selects, but only if they are exactly the ones the caller saw
   * in the dry run; otherwise nothing is deleted and the 409 names the difference.
   */
  async prune(user: SessionUser, request: PruneRequest): Promise<PruneResult> {
    const { scanIds, ...filter } = request;
    await this.requireMayPrune(user, filter);
    const plan = await this.planFor(filter);
    const now = new Set(plan.items.map((i) => i.scanId));
    const seen = new Set(scanIds);
    const unseen = [...now].filter((id) => !seen.has(id)).sort((a, b) => a - b);
    const gone = [...seen].filter((id) => !now.has(id)).sort((a, b) => a - b);
    if (unseen.length || gone.length) {
      const parts = [
        unseen.length ? `it now also selects scan${unseen.length > 1 ? 's' : ''} ${unseen.join(', ')}` : '',
        gone.length ? `it no longer selects scan${gone.length > 1 ? 's' : ''} ${gone.join(', ')}` : '',
      ].filter(Boolean);
      throw new ConflictException({
        message: `Nothing was deleted: the filter's selection changed since the dry run (${parts.join('; ')}). Run the dry run again.`,
        fieldErrors: {
          ...(unseen.length ? { unseen: unseen.map(String) } : {}),
          ...(gone.length ? { gone: gone.map(String) } : {}),
        },
      });
    }
    return this.deleteAll(plan, user.id, 'prune');
  }

  /** The retention run: the policy as the filter, no person acting. */
  async pruneUnattended(filter: PruneFilter, reason: DeletionReason): Promise<PruneResult> {
    return this.deleteAll(await this.planFor(filter), null, reason);
  }

  private async deleteAll(plan: PrunePlan, actorId: number | null, reason: DeletionReason): Promise<PruneResult> {
    const deleted: PruneResult['deleted'] = [];
    // One scan at a time: each is archived, then deleted in its own transaction, so a failure
    // part-way leaves the rest of the list in place and nothing unarchived gone.
    for (const item of plan.items) deleted.push(await this.deletion.delete(item.scanId, actorId, reason, true));
    return { deleted };
  }

  private async requireMayPrune(user: SessionUser, filter: PruneFilter): Promise<void> {
    if (user.siteRole === 'admin') return;
    if (!filter.groupId) {
      const led = await this.maintenanceAccess.ledGroupIds(user);
      if (!led || led.length === 0) throw new ForbiddenException('Pruning is for site admins and group leads');
      throw new BadRequestException({ message: 'groupId: a group lead prunes within one group; name it', fieldErrors: { groupId: ['name the group to prune'] } });
    }
    await this.access.require(user, filter.groupId, 'lead');
  }

  private async planFor(filter: PruneFilter): Promise<PrunePlan> {
    // Live scans are left out whatever the filter says.
    const statuses = filter.statuses.filter((s) => (PRUNABLE_STATUSES as readonly string[]).includes(s));
    const qb = this.db
      .getRepository(Scan)
      .createQueryBuilder('s')
      .innerJoinAndSelect('s.owner', 'owner')
      .innerJoinAndSelect('s.group', 'g')
      .where('s.status IN (:...statuses)', { statuses })
      .orderBy('s.id', 'ASC');
    if (filter.groupId) qb.andWhere('s.groupId = :groupId', { groupId: filter.groupId });
    if (filter.ownerId) qb.andWhere('s.ownerId = :ownerId', { ownerId: filter.ownerId });
    if (filter.tag) qb.andWhere('s.id IN (SELECT t.scan_id FROM scan_tags t WHERE t.tag = :tag)', { tag: filter.tag });
    if (filter.olderThanDays !== undefined) {
      const age = filter.ageBasis === 'created' ? 's.created_at' : 'COALESCE(s.finished_at, s.created_at)';
      qb.andWhere(`${age} < NOW(3) - INTERVAL :days DAY`, { days: filter.olderThanDays });
    }
    const scans = await qb.getMany();
    const points = await this.storage.pointsOf(scans.map((s) => s.id));
    const perPoint = await this.storage.bytesPerPoint();
    const items: PrunePlanItem[] = scans.map((s) => {
      const n = points.get(s.id) ?? 0;
      return {
        scanId: s.id, name: s.name, groupId: s.groupId, groupName: s.group.name, ownerId: s.ownerId, ownerName: s.owner.displayName,
        status: s.status, createdAt: s.createdAt.toISOString(), finishedAt: s.finishedAt?.toISOString() ?? null, points: n,
        bytes: Math.round(n * perPoint),
      };
    });
    return { items, totalPoints: items.reduce((a, i) => a + i.points, 0), totalBytes: items.reduce((a, i) => a + i.bytes, 0) };
  }
}
