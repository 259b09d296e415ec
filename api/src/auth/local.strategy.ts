import { Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { Request } from 'express';
import { Strategy } from 'passport-local';
import type { SessionUser } from '../common/session-user';
import { AuthService } from './auth.service';

@Injectable()
export class LocalStrategy extends PassportStrategy(Strategy) {
  constructor(private readonly auth: AuthService) {
    super({ usernameField: 'email', passwordField: 'password', passReqToCallback: true });
  }

  async validate(req: Request, email: string, password: string): Promise<SessionUser> {
    const user = await this.auth.validateCredentials(email, password, req.ip);
    // One message for unknown e-mail and wrong password, so accounts cannot be probed.
    if (!user) throw new UnauthorizedException('E-mail or password is wrong');
    return user;
  }
}
