import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import type { AdminUser, CurrentUser } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { Membership } from '../groups/entities/membership.entity';
import { User } from './entities/user.entity';

@Injectable()
export class UsersService {
  constructor(
    @InjectRepository(User) private readonly users: Repository<User>,
    @InjectRepository(Membership) private readonly memberships: Repository<Membership>,
  ) {}

  /** The user with the password hash, for sign-in only. */
  findForSignIn(email: string): Promise<User | null> {
    return this.users
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.email = :email', { email: email.trim().toLowerCase() })
      .getOne();
  }

  async findSessionUser(id: number): Promise<SessionUser | null> {
    const user = await this.users.findOne({ where: { id } });
    return user ? { id: user.id, email: user.email, displayName: user.displayName, siteRole: user.siteRole } : null;
  }

  async markSignedIn(id: number): Promise<void> {
    await this.users.update({ id }, { lastLoginAt: new Date() });
  }

  async describe(user: SessionUser): Promise<CurrentUser> {
    const memberships = await this.memberships.find({
      where: { userId: user.id },
      relations: { group: true },
      order: { group: { name: 'ASC' } },
    });
    return {
      ...user,
      memberships: memberships.map((m) => ({
        groupId: m.groupId,
        groupSlug: m.group.slug,
        groupName: m.group.name,
        role: m.role,
      })),
    };
  }

  async listForAdmin(): Promise<AdminUser[]> {
    const rows = await this.users.find({ order: { displayName: 'ASC' } });
    const counts = await this.memberships
      .createQueryBuilder('m')
      .select('m.userId', 'userId')
      .addSelect('COUNT(*)', 'groups')
      .groupBy('m.userId')
      .getRawMany<{ userId: number; groups: string }>();
    const countByUser = new Map(counts.map((c) => [Number(c.userId), Number(c.groups)]));
    return rows.map((u) => ({
      id: u.id,
      email: u.email,
      displayName: u.displayName,
      siteRole: u.siteRole,
      groupCount: countByUser.get(u.id) ?? 0,
      lastLoginAt: u.lastLoginAt?.toISOString() ?? null,
      createdAt: u.createdAt.toISOString(),
    }));
  }
}
