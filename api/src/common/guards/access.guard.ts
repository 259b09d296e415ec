import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { ADMIN_ONLY } from '../decorators/admin-only.decorator';
import { IS_PUBLIC } from '../decorators/public.decorator';

/**
 * The one global guard: deny by default. A route is open only when marked @Public();
 * otherwise it needs a signed-in user, and @AdminOnly() routes need the site admin role.
 * Group roles are checked by the services, which know which group an object belongs to.
 */
@Injectable()
export class AccessGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    const req = context.switchToHttp().getRequest<Request>();
    if (!req.isAuthenticated?.() || !req.user) {
      throw new UnauthorizedException('Sign in first: your session is missing or has expired');
    }
    if (this.reflector.getAllAndOverride<boolean>(ADMIN_ONLY, targets) && req.user.siteRole !== 'admin') {
      throw new ForbiddenException('This needs the site administrator role');
    }
    return true;
  }
}
