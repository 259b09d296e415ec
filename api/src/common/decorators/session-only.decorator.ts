import { applyDecorators, SetMetadata } from '@nestjs/common';
import { ApiCookieAuth } from '@nestjs/swagger';
import { SESSION_SCHEME } from '../../openapi/security-schemes';

export const SESSION_ONLY = 'sixtyfold:sessionOnly';

/**
 * Refuses bearer tokens on a route (or a whole controller): signing in and out, and managing
 * tokens, need a browser session, so a leaked token cannot mint more tokens or revoke the others.
 * The OpenAPI document lists only the session cookie for such routes.
 */
export const SessionOnly = () => applyDecorators(SetMetadata(SESSION_ONLY, true), ApiCookieAuth(SESSION_SCHEME));
