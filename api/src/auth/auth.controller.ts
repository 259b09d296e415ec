import { Body, Controller, Get, HttpCode, Post, Req, Res, UseGuards } from '@nestjs/common';
import type { Request, Response } from 'express';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  changePasswordSchema, currentUserSchema, loginSchema, type ChangePassword, type CurrentUser as CurrentUserDto,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { SessionOnly } from '../common/decorators/session-only.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { UsersService } from '../users/users.service';
import { AuthService } from './auth.service';
import { LocalAuthGuard } from './guards/local-auth.guard';
import { LoginThrottlerGuard } from './guards/login-throttler.guard';
import { SESSION_COOKIE } from './session.constants';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
    private readonly auth: AuthService,
  ) {}

  @Public()
  @SessionOnly()
  @Post('login')
  @HttpCode(200)
  @UseGuards(LoginThrottlerGuard, LocalAuthGuard)
  @ApiOperation({ summary: 'Sign in: starts a session (cookie sixtyfold.sid)' })
  @ApiZodBody(loginSchema)
  @ApiZodResponse(200, currentUserSchema, 'Signed in; the answer is the user with their group memberships')
  @ApiErrorResponses(400, 401, 429, 503)
  login(@CurrentUser() user: SessionUser): Promise<CurrentUserDto> {
    return this.users.describe(user);
  }

  @SessionOnly()
  @Post('logout')
  @HttpCode(204)
  @ApiOperation({ summary: 'Sign out: ends the session' })
  async logout(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    const userId = req.user?.id ?? null;
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    await this.audit.record({ action: 'auth.logout', actorId: userId, targetType: 'user', targetId: userId ?? undefined });
  }

  @SessionOnly()
  @Post('password')
  @HttpCode(204)
  @ApiOperation({ summary: 'Change my password: needs the current one; ends my other sessions and keeps this one signed in' })
  @ApiZodBody(changePasswordSchema)
  @ApiResponse({ status: 204, description: 'Changed; this session stays signed in (with a new session id), the others have ended' })
  @ApiErrorResponses(400, 401, 403)
  async changePassword(
    @Req() req: Request,
    @CurrentUser() user: SessionUser,
    @Body(new ZodValidationPipe(changePasswordSchema)) body: ChangePassword,
  ): Promise<void> {
    await this.auth.changePassword(user, body, req.ip);
    // Signing in again stores the new epoch in this session (under a new id), so it alone survives.
    await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
  }

  @Get('me')
  @ApiOperation({ summary: 'Who I am: the caller, with group ids and roles (works with a session or a token)' })
  @ApiZodResponse(200, currentUserSchema, 'The caller')
  @ApiErrorResponses(401)
  me(@CurrentUser() user: SessionUser): Promise<CurrentUserDto> {
    return this.users.describe(user);
  }
}
