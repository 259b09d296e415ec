import { Injectable } from '@nestjs/common';
import { PassportSerializer } from '@nestjs/passport';
import type { SessionUser } from '../common/session-user';
import { UsersService } from '../users/users.service';

/** The session keeps only the user id; role and name are re-read on every request. */
@Injectable()
export class SessionSerializer extends PassportSerializer {
  constructor(private readonly users: UsersService) {
    super();
  }

  serializeUser(user: SessionUser, done: (err: Error | null, id?: number) => void): void {
    done(null, user.id);
  }

  deserializeUser(id: number, done: (err: Error | null, user?: SessionUser | false) => void): void {
    this.users.findSessionUser(id).then(
      (user) => done(null, user ?? false),
      (err: Error) => done(err),
    );
  }
}
