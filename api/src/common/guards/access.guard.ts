import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { READ_ONLY_METHODS } from '@sixtyfold/shared';
import { TokensService } from '../../tokens/tokens.service';
import { readBearerToken } from '../bearer-token';
import { ADMIN_ONLY } from '../decorators/admin-only.decorator';
import { IS_PUBLIC } from '../decorators/public.decorator';
import { SESSION_ONLY } from '../decorators/session-only.decorator';

/**
 * The one global guard: deny by default. A route is open only when marked @Public();
 * otherwise it needs a caller, and @AdminOnly() routes need the site admin role.
 * The caller comes from exactly one place: the bearer token when an `Authorization: Bearer`
 * header is present (the session is then not even read), otherwise the session.
 * Group roles are checked by the services, which know which group an object belongs to.
 */
@Injectable()
export class AccessGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly tokens: TokensService,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    const req = context.switchToHttp().getRequest<Request>();
    const bearer = readBearerToken(req);
    if (bearer !== undefined && this.reflector.getAllAndOverride<boolean>(SESSION_ONLY, targets)) {
      throw new ForbiddenException('Signing in and out, changing the password and managing API tokens need a browser session; send this request without the Authorization header');
    }
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    if (bearer !== undefined) {
      const { user, readOnly } = await this.tokens.authenticate(bearer);
      if (readOnly && !(READ_ONLY_METHODS as readonly string[]).includes(req.method)) {
        throw new ForbiddenException(`This API token is read-only: it may only read (${READ_ONLY_METHODS.join(', ')}); use a token without read-only for changes`);
      }
      req.user = user;
    } else if (!req.isAuthenticated?.() || !req.user) {
      throw new UnauthorizedException(req.sessionRefusal ?? 'Sign in first: your session is missing or has expired');
    }
    if (this.reflector.getAllAndOverride<boolean>(ADMIN_ONLY, targets) && req.user.siteRole !== 'admin') {
      throw new ForbiddenException('This needs the site administrator role');
    }
    return true;
  }
}
