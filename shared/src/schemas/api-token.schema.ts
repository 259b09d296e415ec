import { z } from 'zod';

/** Every personal API token starts with this, so it is easy to spot in scripts and secret scanners. */
export const API_TOKEN_PREFIX = 'sfy_';
/** `sfy_` and 43 base64url characters (32 random bytes). */
export const API_TOKEN_PATTERN = /^sfy_[A-Za-z0-9_-]{43}$/;
/** Longest lifetime a token may be given: every token expires. */
export const API_TOKEN_MAX_DAYS = 365;
/** The lifetime of a token whose creator names none. */
export const API_TOKEN_DEFAULT_DAYS = 90;
/** The HTTP methods a read-only token may use; anything else answers 403. */
export const READ_ONLY_METHODS = ['GET', 'HEAD', 'OPTIONS'] as const;

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
    .default(API_TOKEN_DEFAULT_DAYS),
  /** A read-only token may only read (GET, HEAD, OPTIONS). */
  readOnly: z.boolean({ error: 'readOnly must be true or false' }).default(false),
});
export type CreateApiToken = z.infer<typeof createApiTokenSchema>;
/** What a form or script sends: the fields with defaults may be left out. */
export type CreateApiTokenInput = z.input<typeof createApiTokenSchema>;

/** A token as `GET /api/tokens` lists it: never the secret, only a prefix to recognise it by. */
export const apiTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  /** The first characters of the token, e.g. `sfy_Ab3dE6gH`. */
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  expiresAt: z.string(),
  readOnly: z.boolean(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;

export const apiTokenListSchema = z.array(apiTokenSchema);

/** The answer of `POST /api/tokens`: the only time the secret is ever sent. */
export const createdApiTokenSchema = apiTokenSchema.extend({
  token: z.string().regex(API_TOKEN_PATTERN),
});
export type CreatedApiToken = z.infer<typeof createdApiTokenSchema>;
