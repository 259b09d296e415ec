import type { Request } from 'express';

/**
 * The token of an `Authorization: Bearer <token>` header: `''` when the scheme is there without a
 * token, `undefined` when there is no bearer header at all (other schemes, such as a proxy's Basic
 * auth, are left alone). A request with a bearer header is authenticated by it and nothing else.
 */
export function readBearerToken(req: Request): string | undefined {
  const header = req.get('authorization')?.trim();
  if (!header) return undefined;
  const [scheme, ...rest] = header.split(/\s+/);
  if (scheme.toLowerCase() !== 'bearer') return undefined;
  return rest.join(' ');
}
