import type { SiteRole } from '@sixtyfold/shared';

/** What a request knows about its caller, loaded fresh from the database on every request. */
export interface SessionUser {
  id: number;
  email: string;
  displayName: string;
  siteRole: SiteRole;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // Passport's `req.user` is our SessionUser.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
    interface Request {
      /** Why the request's session no longer signs anyone in (set by SessionSerializer), for the 401. */
      sessionRefusal?: string;
    }
  }
}
