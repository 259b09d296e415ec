import { SetMetadata } from '@nestjs/common';

export const SESSION_ONLY = 'sixtyfold:sessionOnly';

/**
 * Refuses bearer tokens on a route (or a whole controller): signing in and out, and managing
 * tokens, need a browser session, so a leaked token cannot mint more tokens or revoke the others.
 */
export const SessionOnly = () => SetMetadata(SESSION_ONLY, true);
