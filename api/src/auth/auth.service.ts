import { BadRequestException, ForbiddenException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { ChangePassword } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { User } from '../users/entities/user.entity';
import { toSessionUser, UsersService } from '../users/users.service';
import { burnVerification, hashPassword, verifyPassword } from './passwords';

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
    @InjectDataSource() private readonly db: DataSource,
  ) {}

  /** The user for these credentials, or null; both outcomes are audited. */
  async validateCredentials(email: string, password: string, ip: string | undefined): Promise<SessionUser | null> {
    const user = await this.users.findForSignIn(email);
    const ok = user ? await verifyPassword(user.passwordHash, password) : await burnVerification(password);
    if (!user || !ok) {
      await this.audit.record({
        action: 'auth.login_failed',
        actorId: user?.id ?? null,
        targetType: 'user',
        details: { email: email.trim().toLowerCase(), ip: ip ?? null },
      });
      return null;
    }
    // Only a right password learns that the account is disabled, so a guesser learns nothing.
    if (user.disabledAt) {
      await this.audit.record({
        action: 'auth.login_failed',
        actorId: user.id,
        targetType: 'user',
        targetId: user.id,
        details: { email: user.email, ip: ip ?? null, reason: 'disabled' },
      });
      throw new ForbiddenException('Account disabled: a site administrator has disabled this account and can re-enable it');
    }
    await this.users.markSignedIn(user.id);
    await this.audit.record({ action: 'auth.login', actorId: user.id, targetType: 'user', targetId: user.id, details: { ip: ip ?? null } });
    return toSessionUser(user);
  }

  /**
   * Replaces the caller's password once the current one is confirmed, and raises the account's
   * session epoch in the same transaction, which ends every session made before; the caller's own
   * session is then re-made with the new epoch (AuthController).
   */
  async changePassword(caller: SessionUser, body: ChangePassword, ip: string | undefined): Promise<void> {
    const user = await this.users.findForSignIn(caller.email);
    if (!user || !(await verifyPassword(user.passwordHash, body.currentPassword))) {
      const message = 'This is not your current password';
      throw new BadRequestException({ message: `currentPassword: ${message}`, fieldErrors: { currentPassword: [message] } });
    }
    const passwordHash = await hashPassword(body.newPassword);
    await this.db.transaction(async (tx) => {
      await tx.getRepository(User).update({ id: user.id }, { passwordHash, sessionEpoch: () => 'session_epoch + 1' });
      await this.audit.record({ action: 'user.password_change', actorId: user.id, targetType: 'user', targetId: user.id, details: { ip: ip ?? null } }, tx);
    });
  }
}
