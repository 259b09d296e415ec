import { Injectable } from '@nestjs/common';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { UsersService } from '../users/users.service';
import { burnVerification, verifyPassword } from './passwords';

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
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
    await this.users.markSignedIn(user.id);
    await this.audit.record({ action: 'auth.login', actorId: user.id, targetType: 'user', targetId: user.id, details: { ip: ip ?? null } });
    return { id: user.id, email: user.email, displayName: user.displayName, siteRole: user.siteRole };
  }
}
