import { registerAs } from '@nestjs/config';
import { z } from 'zod';
import { parseEnv } from './parse-env';

const schema = z.object({
  /** How often finished scans are looked for and pending 'immediate' e-mails sent (0: never on a timer). */
  NOTIFY_INTERVAL_SECONDS: z.coerce.number().int().min(0).default(5),
  /** When the daily digest goes out, as a cron expression in the server's time zone. */
  NOTIFY_DIGEST_CRON: z.string().min(9).default('0 7 * * *'),
});

export interface NotificationsConfig {
  intervalSeconds: number;
  digestCron: string;
}

export function readNotificationsConfig(env: NodeJS.ProcessEnv = process.env): NotificationsConfig {
  const e = parseEnv(schema, env, 'notifications');
  return { intervalSeconds: e.NOTIFY_INTERVAL_SECONDS, digestCron: e.NOTIFY_DIGEST_CRON };
}

export const notificationsConfig = registerAs('notifications', () => readNotificationsConfig());
