import { Controller, Get, HttpCode, Post, Req, Res, UseGuards } from '@nestjs/common';
import type { Request, Response } from 'express';
import type { CurrentUser as CurrentUserDto } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { SessionOnly } from '../common/decorators/session-only.decorator';
import type { SessionUser } from '../common/session-user';
import { UsersService } from '../users/users.service';
import { LocalAuthGuard } from './guards/local-auth.guard';
import { LoginThrottlerGuard } from './guards/login-throttler.guard';
import { SESSION_COOKIE } from './session.constants';

@Controller('auth')
export class AuthController {
  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
  ) {}

  @Public()
  @SessionOnly()
  @Post('login')
  @HttpCode(200)
  @UseGuards(LoginThrottlerGuard, LocalAuthGuard)
  login(@CurrentUser() user: SessionUser): Promise<CurrentUserDto> {
    return this.users.describe(user);
  }

  @SessionOnly()
  @Post('logout')
  @HttpCode(204)
  async logout(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    const userId = req.user?.id ?? null;
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    await this.audit.record({ action: 'auth.logout', actorId: userId, targetType: 'user', targetId: userId ?? undefined });
  }

  @Get('me')
  me(@CurrentUser() user: SessionUser): Promise<CurrentUserDto> {
    return this.users.describe(user);
  }
}
