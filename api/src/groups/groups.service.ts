import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager, type Repository } from 'typeorm';
import type { ChangeMemberRole, CreateGroup, GroupDetail, GroupMember, GroupSummary, UpdateGroup } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
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
    private readonly audit: AuditService,
    @InjectDataSource() private readonly db: DataSource,
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
      pointLimit: group.pointLimit,
      members: members.map((m) => this.memberDto(m)),
    };
  }

  /** Site admins create groups; the slug comes from the name. */
  async create(user: SessionUser, body: CreateGroup): Promise<GroupDetail> {
    const slug = slugify(body.name);
    if (!slug) throw new ConflictException('The group name needs at least one letter or digit');
    const id = await this.db.transaction(async (manager) => {
      const repo = manager.getRepository(Group);
      if (await repo.exists({ where: [{ slug }, { name: body.name }] })) {
        throw new ConflictException(`A group named "${body.name}" (or with the address ${slug}) exists already`);
      }
      const group = await repo.save(repo.create({ slug, name: body.name, description: body.description, pointLimit: body.pointLimit }));
      await this.audit.record({ action: 'group.create', actorId: user.id, groupId: group.id, targetType: 'group', targetId: group.id, details: { ...body, slug } }, manager);
      return group.id;
    });
    return this.get(user, id);
  }

  /** Site admins edit a group's name, description and point limit; the slug stays, so links keep working. */
  async update(user: SessionUser, id: number, body: UpdateGroup): Promise<GroupDetail> {
    await this.db.transaction(async (manager) => {
      const repo = manager.getRepository(Group);
      const group = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!group) throw new NotFoundException('No such group');
      if (body.name && body.name !== group.name && (await repo.exists({ where: { name: body.name } }))) {
        throw new ConflictException(`A group named "${body.name}" exists already`);
      }
      const from = { name: group.name, description: group.description, pointLimit: group.pointLimit };
      await repo.update({ id }, body);
      await this.audit.record({ action: 'group.update', actorId: user.id, groupId: id, targetType: 'group', targetId: id, details: { from, to: body } }, manager);
    });
    return this.get(user, id);
  }

  /** Leads and admins change roles; the last lead cannot be demoted. */
  async changeRole(user: SessionUser, groupId: number, userId: number, body: ChangeMemberRole): Promise<GroupMember> {
    await this.access.require(user, groupId, 'lead');
    return this.db.transaction(async (manager) => {
      const { group, member } = await this.lockMember(manager, groupId, userId);
      const from = member.role;
      if (from === body.role) return this.memberDto(member);
      if (from === 'lead') await this.refuseLastLead(manager, group, member, 'demoted');
      await manager.getRepository(Membership).update({ id: member.id }, { role: body.role });
      await this.audit.record({
        action: 'membership.role_change', actorId: user.id, groupId, targetType: 'user', targetId: userId,
        details: { from, to: body.role, email: member.user.email },
      }, manager);
      return this.memberDto({ ...member, role: body.role });
    });
  }

  /** Leads and admins remove anyone; any member may remove themselves (leave). The last lead stays. */
  async removeMember(user: SessionUser, groupId: number, userId: number): Promise<void> {
    const self = user.id === userId;
    await this.access.require(user, groupId, self ? 'viewer' : 'lead');
    await this.db.transaction(async (manager) => {
      const { group, member } = await this.lockMember(manager, groupId, userId);
      if (member.role === 'lead') await this.refuseLastLead(manager, group, member, self ? 'leave' : 'removed');
      await manager.getRepository(Membership).delete({ id: member.id });
      await this.audit.record({
        action: 'membership.remove', actorId: user.id, groupId, targetType: 'user', targetId: userId,
        details: { self, role: member.role, email: member.user.email },
      }, manager);
    });
  }

  /** Locks the group row first, so two concurrent changes to its leads are serialised. */
  private async lockMember(manager: EntityManager, groupId: number, userId: number): Promise<{ group: Group; member: Membership }> {
    const group = await manager.getRepository(Group).findOne({ where: { id: groupId }, lock: { mode: 'pessimistic_write' } });
    if (!group) throw new NotFoundException('No such group');
    const member = await manager.getRepository(Membership).findOne({ where: { groupId, userId }, relations: { user: true } });
    if (!member) throw new NotFoundException('No such member in this group');
    return { group, member };
  }

  private async refuseLastLead(manager: EntityManager, group: Group, member: Membership, what: 'demoted' | 'removed' | 'leave'): Promise<void> {
    const leads = await manager.getRepository(Membership).count({ where: { groupId: group.id, role: 'lead' } });
    if (leads > 1) return;
    const verb = what === 'leave' ? 'cannot leave it' : `cannot be ${what}`;
    throw new ConflictException(`${member.user.displayName} is the last lead of ${group.name} and ${verb}; make someone else lead first`);
  }

  private memberDto(m: Membership): GroupMember {
    return { userId: m.userId, displayName: m.user.displayName, email: m.user.email, role: m.role };
  }

  private summary(g: Group, myRole: GroupSummary['myRole'], memberCount: number): GroupSummary {
    return { id: g.id, slug: g.slug, name: g.name, description: g.description, myRole, memberCount };
  }
}

/** "Plateau Models" → "plateau-models". */
function slugify(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 64);
}
