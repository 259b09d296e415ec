/** Names of the two ways to authenticate, as the OpenAPI document declares them. */
export const SESSION_SCHEME = 'session';
export const TOKEN_SCHEME = 'token';
