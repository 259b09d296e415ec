import { type ExecutionContext, Injectable } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import type { Request } from 'express';
import { loginSchema } from '@sixtyfold/shared';
import { ZodValidationPipe } from '../../common/pipes/zod-validation.pipe';

const validateLogin = new ZodValidationPipe(loginSchema);

/**
 * Validates the body with the shared login schema (400 with field errors), checks the
 * password through passport-local, then starts a session; passport regenerates the session
 * id at log-in, so a session fixed before sign-in is never promoted.
 */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  override async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request>();
    req.body = validateLogin.transform(req.body);
    const ok = (await super.canActivate(context)) as boolean;
    await super.logIn(req);
    return ok;
  }
}
