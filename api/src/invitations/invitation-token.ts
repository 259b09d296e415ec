import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * Invitation link tokens: `<id>.<expiry in ms>.<HMAC-SHA256 of both, base64url>`. Nothing secret
 * is stored; the id finds the row and the signature proves the link was made here.
 */
export function signInvitationToken(secret: string, id: number, expiresAt: Date): string {
  const payload = `${id}.${expiresAt.getTime()}`;
  return `${payload}.${mac(secret, payload)}`;
}

/** The id and expiry a token carries, or null when it is malformed or its signature is wrong. */
export function verifyInvitationToken(secret: string, token: string): { id: number; expiresAtMs: number } | null {
  const match = /^(\d{1,10})\.(\d{1,15})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!match) return null;
  const expected = Buffer.from(mac(secret, `${match[1]}.${match[2]}`));
  const given = Buffer.from(match[3]);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  return { id: Number(match[1]), expiresAtMs: Number(match[2]) };
}

function mac(secret: string, payload: string): string {
  return createHmac('sha256', `sixtyfold-invitation:${secret}`).update(payload).digest('base64url');
}
