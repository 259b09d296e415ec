import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import type { DataSource, Repository } from 'typeorm';
import type { AdminUser, CurrentUser } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { Membership } from '../groups/entities/membership.entity';
import { User } from './entities/user.entity';

@Injectable()
export class UsersService {
  constructor(
    @InjectRepository(User) private readonly users: Repository<User>,
    @InjectRepository(Membership) private readonly memberships: Repository<Membership>,
    @InjectDataSource() private readonly db: DataSource,
    private readonly audit: AuditService,
  ) {}

  /** The user with the password hash, for sign-in only. */
  findForSignIn(email: string): Promise<User | null> {
    return this.users
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.email = :email', { email: email.trim().toLowerCase() })
      .getOne();
  }

  /**
   * Who a session or a token acts as, read fresh on every request, with what decides whether it
   * may act at all: the account's state and its current session epoch.
   */
  async findCaller(id: number): Promise<Caller | null> {
    const user = await this.users
      .createQueryBuilder('u')
      .addSelect('u.sessionEpoch')
      .where('u.id = :id', { id })
      .getOne();
    if (!user) return null;
    return { user: toSessionUser(user), disabled: user.disabledAt !== null, sessionEpoch: user.sessionEpoch };
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
    return rows.map((u) => describeForAdmin(u, countByUser.get(u.id) ?? 0));
  }

  /**
   * Disables or re-enables an account (site admins only, never their own). Disabling raises the
   * session epoch, so the account's sessions end at their next request and stay ended after a
   * re-enable; its tokens are refused while it is disabled. Audited only when the state changes.
   */
  async setDisabled(actor: SessionUser, id: number, disabled: boolean): Promise<AdminUser> {
    if (disabled && actor.id === id) {
      throw new ConflictException('You cannot disable your own account; another site administrator can');
    }
    await this.db.transaction(async (tx) => {
      const users = tx.getRepository(User);
      const user = await users.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!user) throw new NotFoundException('No such account');
      if ((user.disabledAt !== null) === disabled) return;
      if (disabled) {
        await users.update({ id }, { disabledAt: new Date(), sessionEpoch: () => 'session_epoch + 1' });
      } else {
        await users.update({ id }, { disabledAt: null });
      }
      await this.audit.record(
        { action: disabled ? 'user.disable' : 'user.enable', actorId: actor.id, targetType: 'user', targetId: id, details: { email: user.email } },
        tx,
      );
    });
    const user = await this.users.findOneByOrFail({ id });
    return describeForAdmin(user, await this.memberships.countBy({ userId: id }));
  }
}

function describeForAdmin(u: User, groupCount: number): AdminUser {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    siteRole: u.siteRole,
    groupCount,
    lastLoginAt: u.lastLoginAt?.toISOString() ?? null,
    createdAt: u.createdAt.toISOString(),
    disabledAt: u.disabledAt?.toISOString() ?? null,
  };
}

export interface Caller {
  user: SessionUser;
  disabled: boolean;
  sessionEpoch: number;
}

export function toSessionUser(user: User): SessionUser {
  return { id: user.id, email: user.email, displayName: user.displayName, siteRole: user.siteRole };
}
