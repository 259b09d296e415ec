import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import type { DataSource, Repository } from 'typeorm';
import { pointCount, pointLimitProblem, type CreateScan, type Page, type PageQuery, type ScanSummary } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import type { AppConfig } from '../config/app.config';
import { Group } from '../groups/entities/group.entity';
import { GroupAccessService } from '../groups/group-access.service';
import { PotentialModel } from '../models/entities/potential-model.entity';
import { Scan } from './entities/scan.entity';
import { ScanTag } from './entities/scan-tag.entity';
import { ScanQueueService } from './scan-queue.service';
import { completeSpec, familyModel } from './scan-submission';

@Injectable()
export class ScansService {
  constructor(
    @InjectRepository(Scan) private readonly scans: Repository<Scan>,
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly queue: ScanQueueService,
    private readonly audit: AuditService,
    private readonly config: ConfigService,
  ) {}

  /** Validates against the model and the limits, stores the scan, then queues its chunks. */
  async create(user: SessionUser, spec: CreateScan): Promise<ScanSummary> {
    await this.access.require(user, spec.groupId, 'member');
    const group = await this.db.getRepository(Group).findOneByOrFail({ id: spec.groupId });
    let model;
    if (spec.model.kind === 'family') {
      model = familyModel(spec.model.family);
      if (!model) throw new BadRequestException({ message: `model.family: no built-in family '${spec.model.family}'`, fieldErrors: { 'model.family': [`no built-in family '${spec.model.family}'`] } });
    } else {
      const row = await this.db.getRepository(PotentialModel).findOneBy({ id: spec.model.modelId });
      if (!row || row.groupId !== spec.groupId) throw new NotFoundException('No such model in this group');
      model = { source: row.expression, parameters: row.parameters, phiInit: row.phiInit, isFamily: false };
    }
    const stored = completeSpec(spec, model);
    const total = pointCount(spec);
    const site = this.config.getOrThrow<AppConfig>('app').sitePointLimit;
    const tooLarge = pointLimitProblem(total, group.pointLimit, `${group.name}'s`) ?? pointLimitProblem(total, site, "the site's");
    if (tooLarge) throw new BadRequestException({ message: tooLarge, fieldErrors: { axes: [tooLarge] } });

    const scanId = await this.db.transaction(async (tx) => {
      const saved = await tx.getRepository(Scan).save({
        groupId: spec.groupId,
        ownerId: user.id,
        modelId: spec.model.kind === 'group' ? spec.model.modelId : null,
        family: spec.model.kind === 'family' ? spec.model.family : null,
        name: spec.name,
        method: spec.method,
        status: 'queued',
        spec: stored as unknown as Record<string, unknown>,
        note: spec.note,
        totalPoints: total,
        queuedAt: new Date(),
      });
      const tags = [...new Set(spec.tags)];
      if (tags.length) await tx.getRepository(ScanTag).insert(tags.map((tag) => ({ scanId: saved.id, tag })));
      await this.audit.record({ action: 'scan.create', actorId: user.id, groupId: spec.groupId, targetType: 'scan', targetId: saved.id, details: { points: total } }, tx);
      return saved.id;
    });
    // Queued after the commit: a worker must find the row. If Redis fails here the scan stays
    // queued in MariaDB and start-up reconciliation enqueues it.
    await this.queue.enqueue(scanId, total, spec.method);
    return this.get(user, scanId);
  }

  async list(user: SessionUser, query: PageQuery): Promise<Page<ScanSummary>> {
    const ids = await this.access.readableGroupIds(user);
    if (ids && ids.length === 0) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
    const qb = this.scans
      .createQueryBuilder('s')
      .leftJoinAndSelect('s.owner', 'owner')
      .leftJoinAndSelect('s.tags', 'tags')
      .orderBy('s.createdAt', 'DESC')
      .addOrderBy('s.id', 'DESC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    if (ids) qb.where('s.groupId IN (:...ids)', { ids });
    const [rows, total] = await qb.getManyAndCount();
    return { items: rows.map(toSummary), total, page: query.page, pageSize: query.pageSize };
  }

  async get(user: SessionUser, id: number): Promise<ScanSummary> {
    const scan = await this.scans.findOne({ where: { id }, relations: { owner: true, tags: true } });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    return toSummary(scan);
  }
}

function toSummary(s: Scan): ScanSummary {
  return {
    id: s.id,
    groupId: s.groupId,
    ownerId: s.ownerId,
    ownerName: s.owner.displayName,
    name: s.name,
    method: s.method,
    status: s.status,
    tags: (s.tags ?? []).map((t) => t.tag).sort(),
    totalPoints: s.totalPoints,
    donePoints: s.donePoints,
    failedPoints: s.failedPoints,
    createdAt: s.createdAt.toISOString(),
    finishedAt: s.finishedAt?.toISOString() ?? null,
  };
}
