import { applyDecorators, SetMetadata } from '@nestjs/common';
import { ApiSecurity } from '@nestjs/swagger';

export const IS_PUBLIC = 'sixtyfold:isPublic';

/**
 * Opens a route to callers who are not signed in; every other route needs a session or a token.
 * The OpenAPI document shows the route as needing no credentials (an empty security requirement).
 */
export const Public = () => applyDecorators(SetMetadata(IS_PUBLIC, true), ApiSecurity({}));
