import { registerAs } from '@nestjs/config';
import path from 'node:path';
import { z } from 'zod';
import { HOST_SYNTAX } from '../common/middleware/host-check.middleware';
import { parseEnv } from './parse-env';

const booleanish = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

const schema = z.object({
  API_HOST: z.string().default('127.0.0.1'),
  API_PORT: z.coerce.number().int().min(1).max(65535).default(3060),
  WEB_DIST_DIR: z.string().default(path.resolve(process.cwd(), '../web/dist')),
  SESSION_SECRET: z.string().min(16, 'SESSION_SECRET must be at least 16 characters').optional(),
  SESSION_TTL_SECONDS: z.coerce.number().int().min(1).default(12 * 3600),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  TRUST_PROXY: booleanish.default(false),
  /** Sign-in attempts per address (whatever the e-mails) and per e-mail (whatever the addresses) within the window. */
  LOGIN_THROTTLE_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(30),
  LOGIN_THROTTLE_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(10),
  LOGIN_THROTTLE_TTL_SECONDS: z.coerce.number().int().min(1).default(60),
  /** argon2id checks and hashes running at once (64 MiB each), and how many may wait for one. */
  PASSWORD_CHECK_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(4),
  PASSWORD_CHECK_QUEUE: z.coerce.number().int().min(0).max(10_000).default(32),
  /** Further names (host or host:port) the site is reached by, besides APP_URL's; comma-separated. */
  ALLOWED_HOSTS: z
    .string()
    .default('')
    .refine(
      (v) => v.split(',').map((h) => h.trim()).filter(Boolean).every((h) => HOST_SYNTAX.test(h)),
      'ALLOWED_HOSTS must list host names or host:port, comma-separated, e.g. sixtyfold.internal.example,10.0.0.5:3060',
    ),
  SITE_POINT_LIMIT: z.coerce.number().int().min(1).default(1_000_000),
  RECONCILE_INTERVAL_SECONDS: z.coerce.number().int().min(0).default(30),
  NODE_ENV: z.string().default('development'),
});

export interface AppConfig {
  host: string;
  port: number;
  webDistDir: string;
  sessionSecret: string;
  sessionTtlSeconds: number;
  cookieSecure: 'auto' | boolean;
  trustProxy: boolean;
  loginThrottle: { addressLimit: number; accountLimit: number; ttlMs: number };
  passwordChecks: { concurrency: number; queue: number };
  /** Host names (and ports) besides APP_URL's that requests may name; see host-check.middleware.ts. */
  allowedHosts: string[];
  /** Outside production, 127.0.0.1, localhost and [::1] on any port are accepted as well. */
  allowLoopbackHosts: boolean;
  /** Largest scan, in points, that any group may submit. */
  sitePointLimit: number;
  /** How often live scans are checked against their stored points (0: only at start). */
  reconcileIntervalSeconds: number;
}

export function readAppConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const e = parseEnv(schema, env, 'app');
  if (!e.SESSION_SECRET && e.NODE_ENV === 'production') {
    throw new Error('Invalid app configuration: SESSION_SECRET is required in production');
  }
  return {
    host: e.API_HOST,
    port: e.API_PORT,
    webDistDir: e.WEB_DIST_DIR,
    // Development without a secret still gets signed cookies; `npm start` always passes one.
    sessionSecret: e.SESSION_SECRET ?? 'sixtyfold-development-only-secret',
    sessionTtlSeconds: e.SESSION_TTL_SECONDS,
    cookieSecure: e.COOKIE_SECURE === 'auto' ? 'auto' : e.COOKIE_SECURE === 'true',
    trustProxy: e.TRUST_PROXY,
    loginThrottle: {
      addressLimit: e.LOGIN_THROTTLE_ADDRESS_LIMIT,
      accountLimit: e.LOGIN_THROTTLE_ACCOUNT_LIMIT,
      ttlMs: e.LOGIN_THROTTLE_TTL_SECONDS * 1000,
    },
    passwordChecks: { concurrency: e.PASSWORD_CHECK_CONCURRENCY, queue: e.PASSWORD_CHECK_QUEUE },
    allowedHosts: e.ALLOWED_HOSTS.split(',').map((h) => h.trim()).filter(Boolean),
    allowLoopbackHosts: e.NODE_ENV !== 'production',
    sitePointLimit: e.SITE_POINT_LIMIT,
    reconcileIntervalSeconds: e.RECONCILE_INTERVAL_SECONDS,
  };
}

export const appConfig = registerAs('app', () => readAppConfig());
