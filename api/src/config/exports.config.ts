import { registerAs } from '@nestjs/config';
import { z } from 'zod';
import { parseEnv } from './parse-env';

const schema = z.object({
  // Streamed downloads open at once, per API process: each holds a database connection (or a file) while it runs.
  EXPORTS_PER_USER: z.coerce.number().int().min(1).default(2),
  EXPORTS_PER_SITE: z.coerce.number().int().min(1).default(4),
  // A download whose client has not taken any bytes for this long is ended.
  EXPORT_STALL_SECONDS: z.coerce.number().positive().default(30),
});

export interface ExportsConfig {
  perUser: number;
  perSite: number;
  stallMs: number;
}

export function readExportsConfig(env: NodeJS.ProcessEnv = process.env): ExportsConfig {
  const e = parseEnv(schema, env, 'exports');
  return { perUser: e.EXPORTS_PER_USER, perSite: e.EXPORTS_PER_SITE, stallMs: e.EXPORT_STALL_SECONDS * 1000 };
}

export const exportsConfig = registerAs('exports', () => readExportsConfig());
