import { z } from 'zod';

/** Every personal API token starts with this, so it is easy to spot in scripts and secret scanners. */
export const API_TOKEN_PREFIX = 'sfy_';
/** `sfy_` and 43 base64url characters (32 random bytes). */
export const API_TOKEN_PATTERN = /^sfy_[A-Za-z0-9_-]{43}$/;
/** Longest lifetime a token may be given; leaving `expiresInDays` out means no expiry. */
export const API_TOKEN_MAX_DAYS = 365;

/** Body of `POST /api/tokens`; the token form validates with the same schema. */
export const createApiTokenSchema = z.object({
  name: z
    .string({ error: 'give the token a name' })
    .trim()
    .min(1, 'give the token a name')
    .max(100, 'names are at most 100 characters'),
  expiresInDays: z
    .number({ error: 'expiresInDays must be a number of days' })
    .int('expiresInDays must be a whole number of days')
    .min(1, 'a token lives at least 1 day')
    .max(API_TOKEN_MAX_DAYS, `a token lives at most ${API_TOKEN_MAX_DAYS} days`)
    .optional(),
});
export type CreateApiToken = z.infer<typeof createApiTokenSchema>;

/** A token as `GET /api/tokens` lists it: never the secret, only a prefix to recognise it by. */
export const apiTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  /** The first characters of the token, e.g. `sfy_Ab3dE6gH`. */
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  expiresAt: z.string().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;

export const apiTokenListSchema = z.array(apiTokenSchema);

/** The answer of `POST /api/tokens`: the only time the secret is ever sent. */
export const createdApiTokenSchema = apiTokenSchema.extend({
  token: z.string().regex(API_TOKEN_PATTERN),
});
export type CreatedApiToken = z.infer<typeof createdApiTokenSchema>;
