import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import type { Page, PageQuery, ScanSummary } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { GroupAccessService } from '../groups/group-access.service';
import { Scan } from './entities/scan.entity';

@Injectable()
export class ScansService {
  constructor(
    @InjectRepository(Scan) private readonly scans: Repository<Scan>,
    private readonly access: GroupAccessService,
  ) {}

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
