import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { In, type Repository } from 'typeorm';
import type { GroupDetail, GroupSummary } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { Group } from './entities/group.entity';
import { Membership } from './entities/membership.entity';
import { GroupAccessService } from './group-access.service';

@Injectable()
export class GroupsService {
  constructor(
    @InjectRepository(Group) private readonly groups: Repository<Group>,
    @InjectRepository(Membership) private readonly memberships: Repository<Membership>,
    private readonly access: GroupAccessService,
  ) {}

  async list(user: SessionUser): Promise<GroupSummary[]> {
    const ids = await this.access.readableGroupIds(user);
    if (ids && ids.length === 0) return [];
    const rows = await this.groups.find({ where: ids ? { id: In(ids) } : {}, order: { name: 'ASC' } });
    const counts = await this.memberships
      .createQueryBuilder('m')
      .select('m.groupId', 'groupId')
      .addSelect('COUNT(*)', 'members')
      .groupBy('m.groupId')
      .getRawMany<{ groupId: number; members: string }>();
    const countByGroup = new Map(counts.map((c) => [Number(c.groupId), Number(c.members)]));
    const mine = await this.memberships.find({ where: { userId: user.id } });
    const roleByGroup = new Map(mine.map((m) => [m.groupId, m.role]));
    return rows.map((g) => this.summary(g, roleByGroup.get(g.id) ?? null, countByGroup.get(g.id) ?? 0));
  }

  async get(user: SessionUser, id: number): Promise<GroupDetail> {
    await this.access.require(user, id, 'viewer');
    const group = await this.groups.findOne({ where: { id } });
    if (!group) throw new NotFoundException('No such group');
    const members = await this.memberships.find({
      where: { groupId: id },
      relations: { user: true },
      order: { user: { displayName: 'ASC' } },
    });
    const myRole = members.find((m) => m.userId === user.id)?.role ?? null;
    return {
      ...this.summary(group, myRole, members.length),
      members: members.map((m) => ({ userId: m.userId, displayName: m.user.displayName, email: m.user.email, role: m.role })),
    };
  }

  private summary(g: Group, myRole: GroupSummary['myRole'], memberCount: number): GroupSummary {
    return { id: g.id, slug: g.slug, name: g.name, description: g.description, myRole, memberCount };
  }
}
