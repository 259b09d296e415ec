import { Injectable } from '@nestjs/common';
import type { Request } from 'express';
import passport from 'passport';
import type { SessionUser } from '../common/session-user';
import { UsersService } from '../users/users.service';

/** What a session stores: the user id and the session epoch it was made in. */
interface SessionPayload {
  id: number;
  epoch: number;
}

/**
 * The session keeps only the user id and the account's session epoch at sign-in; role and name
 * are re-read on every request. A session whose epoch is older than the account's (the password
 * was changed, or the account was disabled since) ends there, and a disabled account's session
 * never yields a user. The reason goes on `req.sessionRefusal` for AccessGuard's 401.
 *
 * Registered with passport directly rather than through @nestjs/passport's PassportSerializer,
 * whose deserializer is not given the request.
 */
@Injectable()
export class SessionSerializer {
  constructor(private readonly users: UsersService) {
    passport.serializeUser<SessionPayload>((user, done) => {
      this.users.findCaller((user as SessionUser).id).then(
        (caller) => (caller ? done(null, { id: caller.user.id, epoch: caller.sessionEpoch }) : done(new Error('the account to sign in has gone'))),
        (err: Error) => done(err),
      );
    });
    passport.deserializeUser((req: Request, payload: SessionPayload | number, done: (err: Error | null, user?: SessionUser | false) => void) => {
      // Sessions from before epochs stored the bare id; they count as epoch 0.
      const { id, epoch } = typeof payload === 'number' ? { id: payload, epoch: 0 } : payload;
      this.users.findCaller(id).then(
        (caller) => {
          const refusal = !caller
            ? 'Sign in first: your account no longer exists'
            : caller.disabled
              ? 'Account disabled: a site administrator has disabled this account and can re-enable it'
              : caller.sessionEpoch !== epoch
                ? 'Your session has ended (your password was changed, or an administrator ended your sessions); sign in again'
                : undefined;
          if (refusal) req.sessionRefusal = refusal;
          done(null, refusal ? false : caller!.user);
        },
        (err: Error) => done(err),
      );
    });
  }
}
