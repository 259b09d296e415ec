import { registerAs } from '@nestjs/config';
import path from 'node:path';
import { z } from 'zod';
import { parseEnv } from './parse-env';

const schema = z.object({
  ARCHIVE_DIR: z.string().min(1).default(path.resolve(process.cwd(), '../.data/dev/archives')),
  // Five or six cron fields; checked again by the cron library when the job is registered.
  RETENTION_CRON: z.string().regex(/^\S+(\s+\S+){4,5}$/, 'RETENTION_CRON must be a cron expression such as "30 3 * * *"').default('30 3 * * *'),
  RETENTION_TIME_ZONE: z.string().min(1).default('UTC'),
});

export interface MaintenanceConfig {
  /** Where a scan's archive is written before the scan is deleted. */
  archiveDir: string;
  /** When the nightly retention run starts. */
  retentionCron: string;
  retentionTimeZone: string;
}

export function readMaintenanceConfig(env: NodeJS.ProcessEnv = process.env): MaintenanceConfig {
  const e = parseEnv(schema, env, 'maintenance');
  return { archiveDir: path.resolve(e.ARCHIVE_DIR), retentionCron: e.RETENTION_CRON, retentionTimeZone: e.RETENTION_TIME_ZONE };
}

export const maintenanceConfig = registerAs('maintenance', () => readMaintenanceConfig());
