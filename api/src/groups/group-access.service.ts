import { ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import { groupRoleAtLeast, type GroupRole } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { Membership } from './entities/membership.entity';

/**
 * The one place that decides what a user may do in a group. Objects of a group the user is
 * not in answer 404, never 403, so their existence is not revealed.
 */
@Injectable()
export class GroupAccessService {
  constructor(@InjectRepository(Membership) private readonly memberships: Repository<Membership>) {}

  /** Ids of the groups whose objects the user may read; `null` means every group (site admin). */
  async readableGroupIds(user: SessionUser): Promise<number[] | null> {
    if (user.siteRole === 'admin') return null;
    const rows = await this.memberships.find({ where: { userId: user.id }, select: { groupId: true } });
    return rows.map((m) => m.groupId);
  }

  async roleIn(user: SessionUser, groupId: number): Promise<GroupRole | null> {
    const m = await this.memberships.findOne({ where: { userId: user.id, groupId } });
    return m?.role ?? null;
  }

  /**
   * Throws 404 when the user cannot see the group and 403 when they see it but lack `minRole`.
   * Site admins act as leads everywhere.
   */
  async require(user: SessionUser, groupId: number, minRole: GroupRole, what = 'group'): Promise<void> {
    const role = await this.roleIn(user, groupId);
    if (user.siteRole === 'admin') return;
    if (!role) throw new NotFoundException(`No such ${what}`);
    if (!groupRoleAtLeast(role, minRole)) {
      throw new ForbiddenException(`This needs the ${minRole} role in the group; you are ${role}`);
    }
  }
}
