import {
  BadGatewayException, ConflictException, ForbiddenException, GoneException, Injectable, Logger, NotFoundException, UnauthorizedException,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, IsNull, MoreThan, type Repository } from 'typeorm';
import {
  GROUP_ROLE_DESCRIPTIONS, newAccountSchema,
  type AcceptInvitation, type CreateInvitation, type Invitation as InvitationDto, type InvitationPreview,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { hashPassword } from '../auth/passwords';
import { zodBadRequest } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import type { AppConfig } from '../config/app.config';
import type { InvitationConfig } from '../config/invitation.config';
import { Group } from '../groups/entities/group.entity';
import { Membership } from '../groups/entities/membership.entity';
import { GroupAccessService } from '../groups/group-access.service';
import { MailQuotaService } from '../mail/mail-quota.service';
import { MailService } from '../mail/mail.service';
import { Notification } from '../notifications/entities/notification.entity';
import { NotificationsService } from '../notifications/notifications.service';
import { User } from '../users/entities/user.entity';
import { Invitation } from './entities/invitation.entity';
import { signInvitationToken, verifyInvitationToken } from './invitation-token';

const INVALID_LINK = 'This invitation link is not valid; check that it was copied whole, or ask for a new invitation';

export interface AcceptedInvitation {
  groupId: number;
  /** The account that joined; the controller signs it in when it was just created. */
  user: SessionUser;
  created: boolean;
}

@Injectable()
export class InvitationsService {
  private readonly logger = new Logger(InvitationsService.name);
  private readonly secret: string;
  private readonly ttlMs: number;

  constructor(
    config: ConfigService,
    @InjectDataSource() private readonly db: DataSource,
    @InjectRepository(Invitation) private readonly invitations: Repository<Invitation>,
    @InjectRepository(User) private readonly users: Repository<User>,
    private readonly access: GroupAccessService,
    private readonly mail: MailService,
    private readonly mailQuota: MailQuotaService,
    private readonly audit: AuditService,
    private readonly notifications: NotificationsService,
  ) {
    const invitation = config.getOrThrow<InvitationConfig>('invitation');
    this.secret = invitation.secret ?? config.getOrThrow<AppConfig>('app').sessionSecret;
    this.ttlMs = invitation.ttlMs;
  }

  /** Pending invitations of a group, newest first. */
  async listPending(user: SessionUser, groupId: number): Promise<InvitationDto[]> {
    await this.access.require(user, groupId, 'lead');
    const rows = await this.invitations.find({
      where: { groupId, acceptedAt: IsNull(), revokedAt: IsNull(), expiresAt: MoreThan(new Date()) },
      relations: { invitedBy: true },
      order: { createdAt: 'DESC', id: 'DESC' },
    });
    return Promise.all(rows.map((r) => this.toDto(r)));
  }

  /**
   * Creates the invitation and sends its e-mail in one transaction: when the mail server refuses
   * the message, nothing is saved. Re-inviting a pending address replaces its earlier invitation.
   * Each invitation counts against the lead's hourly limit (MAIL_INVITATION_LIMIT_PER_HOUR).
   */
  async invite(user: SessionUser, groupId: number, body: CreateInvitation): Promise<InvitationDto> {
    await this.access.require(user, groupId, 'lead');
    const group = await this.db.getRepository(Group).findOneByOrFail({ id: groupId });
    const existing = await this.users.findOne({ where: { email: body.email } });
    if (existing && (await this.db.getRepository(Membership).exists({ where: { groupId, userId: existing.id } }))) {
      throw new ConflictException(`${body.email} is already a member of ${group.name}; change their role in the member list instead`);
    }
    // Past the lead's hourly limit: a 429 before anything is saved or sent.
    await this.mailQuota.take(user.id, 'invitation', 1);
    const saved = await this.db.transaction(async (manager) => {
      const repo = manager.getRepository(Invitation);
      const replaced = await repo.find({ where: { groupId, email: body.email, acceptedAt: IsNull(), revokedAt: IsNull() }, lock: { mode: 'pessimistic_write' } });
      const now = new Date();
      for (const old of replaced) await repo.update({ id: old.id }, { revokedAt: now });
      const invitation = await repo.save(repo.create({
        groupId, email: body.email, role: body.role, invitedById: user.id, expiresAt: new Date(now.getTime() + this.ttlMs),
      }));
      await this.audit.record({
        action: 'membership.invite', actorId: user.id, groupId, targetType: 'invitation', targetId: invitation.id,
        details: { email: body.email, role: body.role, replaced: replaced.map((r) => r.id) },
      }, manager);
      const link = await this.sendInvitationMail(invitation, group, user);
      if (existing) {
        // Someone with an account also sees the invitation in the app. The invitation mail just
        // sent is its e-mail, so the notice is marked as mailed and never mailed a second time.
        const eventKey = `invitation-${invitation.id}`;
        await this.notifications.notify(existing.id, 'invited', {
          title: `${user.displayName} invites you to ${group.name} as ${body.role}`,
          link: new URL(link).pathname, groupId, groupName: group.name, actorName: user.displayName,
        }, eventKey, manager);
        await manager.getRepository(Notification).update({ userId: existing.id, eventKey }, { emailedAt: new Date() });
      }
      return invitation;
    });
    return this.toDto({ ...saved, invitedBy: { displayName: user.displayName } as User });
  }

  async revoke(user: SessionUser, groupId: number, invitationId: number): Promise<void> {
    await this.access.require(user, groupId, 'lead');
    await this.db.transaction(async (manager) => {
      const repo = manager.getRepository(Invitation);
      const invitation = await repo.findOne({ where: { id: invitationId, groupId }, lock: { mode: 'pessimistic_write' } });
      if (!invitation) throw new NotFoundException('No such invitation');
      if (invitation.acceptedAt) throw new ConflictException('This invitation was already accepted; remove the member instead');
      if (invitation.revokedAt) throw new ConflictException('This invitation was already revoked');
      await repo.update({ id: invitation.id }, { revokedAt: new Date() });
      await this.audit.record({
        action: 'membership.invite_revoke', actorId: user.id, groupId, targetType: 'invitation', targetId: invitation.id,
        details: { email: invitation.email, role: invitation.role },
      }, manager);
    });
  }

  /** What the accept page shows; tampered, expired, revoked or used links throw with a reason. */
  async preview(token: string): Promise<InvitationPreview> {
    const invitation = await this.findUsable(token);
    const account = await this.users.exists({ where: { email: invitation.email } });
    return {
      groupId: invitation.groupId,
      groupName: invitation.group.name,
      role: invitation.role,
      email: invitation.email,
      invitedByName: invitation.invitedBy?.displayName ?? null,
      expiresAt: invitation.expiresAt.toISOString(),
      accountExists: account,
    };
  }

  /**
   * Accepting adds the membership. A new address gets its account from the body's name and
   * password; an existing account must be the one signed in, so a forwarded link cannot be used
   * to join someone else's account.
   */
  async accept(token: string, caller: SessionUser | undefined, body: AcceptInvitation): Promise<AcceptedInvitation> {
    const checked = await this.findUsable(token);
    return this.db.transaction(async (manager) => {
      const invitation = await manager.getRepository(Invitation).findOne({ where: { id: checked.id }, lock: { mode: 'pessimistic_write' } });
      if (!invitation || invitation.acceptedAt || invitation.revokedAt) throw new GoneException('This invitation was already used or revoked');
      const users = manager.getRepository(User);
      let account = await users.findOne({ where: { email: invitation.email } });
      let created = false;
      if (account) {
        if (!caller) throw new UnauthorizedException(`Sign in as ${invitation.email} first, then open this link again to join`);
        if (caller.id !== account.id) {
          throw new ForbiddenException(`This invitation is for ${invitation.email}, but you are signed in as ${caller.email}; sign out and sign in as ${invitation.email}`);
        }
      } else {
        const parsed = newAccountSchema.safeParse(body);
        if (!parsed.success) throw zodBadRequest(parsed.error);
        account = await users.save(users.create({
          email: invitation.email, displayName: parsed.data.displayName, passwordHash: await hashPassword(parsed.data.password), siteRole: 'user',
        }));
        created = true;
      }
      const memberships = manager.getRepository(Membership);
      if (await memberships.exists({ where: { groupId: invitation.groupId, userId: account.id } })) {
        throw new ConflictException(`You are already a member of ${checked.group.name}`);
      }
      await memberships.insert({ groupId: invitation.groupId, userId: account.id, role: invitation.role });
      await manager.getRepository(Invitation).update({ id: invitation.id }, { acceptedAt: new Date(), acceptedById: account.id });
      await this.audit.record({
        action: 'membership.join', actorId: account.id, groupId: invitation.groupId, targetType: 'invitation', targetId: invitation.id,
        details: { email: invitation.email, role: invitation.role, accountCreated: created },
      }, manager);
      return {
        groupId: invitation.groupId,
        user: { id: account.id, email: account.email, displayName: account.displayName, siteRole: account.siteRole },
        created,
      };
    });
  }

  private async findUsable(token: string): Promise<Invitation> {
    const claim = verifyInvitationToken(this.secret, token);
    if (!claim) throw new NotFoundException(INVALID_LINK);
    const invitation = await this.invitations.findOne({ where: { id: claim.id }, relations: { group: true, invitedBy: true } });
    if (!invitation || invitation.expiresAt.getTime() !== claim.expiresAtMs) throw new NotFoundException(INVALID_LINK);
    if (invitation.acceptedAt) throw new GoneException('This invitation was already accepted; sign in to reach the group');
    if (invitation.revokedAt) throw new GoneException('This invitation was withdrawn by the group; ask its lead for a new one');
    if (invitation.expiresAt.getTime() <= Date.now()) throw new GoneException('This invitation has expired; ask the group lead to invite you again');
    return invitation;
  }

  /** Sends the invitation e-mail and answers the link it carries. */
  private async sendInvitationMail(invitation: Invitation, group: Group, inviter: SessionUser): Promise<string> {
    const link = this.mail.link(`invitations/${signInvitationToken(this.secret, invitation.id, invitation.expiresAt)}`);
    const expires = invitation.expiresAt.toUTCString();
    try {
      await this.mail.send(invitation.email, {
        subject: `${inviter.displayName} invites you to ${group.name} on Sixtyfold`,
        heading: `Join ${group.name}`,
        paragraphs: [
          `${inviter.displayName} (${inviter.email}) has invited you to the group ${group.name} on Sixtyfold, where the group runs its inflation-model parameter scans.`,
          `Your role will be ${invitation.role}: you may ${GROUP_ROLE_DESCRIPTIONS[invitation.role]}.`,
          `Open the link below to accept. If you have no Sixtyfold account yet, you choose your name and password there. The link works once and until ${expires}.`,
        ],
        action: { label: 'Accept the invitation', url: link },
        footer: 'If you did not expect this invitation, you can ignore this message; nothing happens unless the link is opened and accepted.',
      });
    } catch (err) {
      this.logger.warn(`invitation mail to ${invitation.email} failed: ${(err as Error).message}`);
      throw new BadGatewayException(`The mail server refused the invitation to ${invitation.email}, so it was not saved; try again later or tell the site administrator`);
    }
    return link;
  }

  private async toDto(row: Invitation): Promise<InvitationDto> {
    const account = await this.users.findOne({ where: { email: row.email }, select: { id: true } });
    return {
      id: row.id,
      groupId: row.groupId,
      email: row.email,
      role: row.role,
      invitedByName: row.invitedBy?.displayName ?? null,
      createdAt: row.createdAt.toISOString(),
      expiresAt: row.expiresAt.toISOString(),
      inviteeUserId: account?.id ?? null,
    };
  }
}
