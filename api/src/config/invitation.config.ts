import { registerAs } from '@nestjs/config';
import { z } from 'zod';
import { parseEnv } from './parse-env';

const schema = z.object({
  /** Key for signing invitation links; without it the session secret is used. */
  INVITATION_SECRET: z.string().min(16, 'INVITATION_SECRET must be at least 16 characters').optional(),
  INVITATION_TTL_DAYS: z.coerce.number().min(0.001).max(90).default(7),
});

export interface InvitationConfig {
  secret: string | null;
  ttlMs: number;
}

export function readInvitationConfig(env: NodeJS.ProcessEnv = process.env): InvitationConfig {
  const e = parseEnv(schema, env, 'invitation');
  return { secret: e.INVITATION_SECRET ?? null, ttlMs: Math.round(e.INVITATION_TTL_DAYS * 24 * 3600 * 1000) };
}

export const invitationConfig = registerAs('invitation', () => readInvitationConfig());
