import type { QueueOptions } from 'bull';
import { createClient } from 'redis';
import type { RedisConfig } from '../config/redis.config';

export type RedisClient = ReturnType<typeof createClient>;

/** Redis's answers to credentials it does not accept: retrying cannot help. */
const REFUSED = /WRONGPASS|NOAUTH|NOPERM|invalid password|invalid username/i;

/**
 * Connects a node-redis client with the configured user, password and TLS. A refusal of the
 * credentials before the first successful connection ends the attempt with Redis's answer, so a
 * process given a wrong password stops at boot instead of retrying forever; once connected, any
 * later drop (Redis restarting) is retried as before.
 */
export async function connectRedis(config: RedisConfig): Promise<RedisClient> {
  let connected = false;
  const client = createClient({
    url: config.url,
    socket: {
      ...(config.tls ? { tls: true as const, ...config.tls } : {}),
      reconnectStrategy: (retries: number, cause: Error) =>
        !connected && REFUSED.test(cause.message) ? cause : Math.min(100 * 2 ** retries, 3000),
    },
  });
  // Errors while Redis restarts are logged by the health check; reconnection is automatic.
  client.on('error', () => undefined);
  client.on('ready', () => (connected = true));
  try {
    await client.connect();
  } catch (err) {
    throw new Error(`Redis at ${config.label} refused the connection: ${(err as Error).message} (check the user and password in REDIS_URL)`);
  }
  return client;
}

/** The same connection settings for bull's own ioredis clients. */
export function bullRedisOptions(config: RedisConfig): NonNullable<QueueOptions['redis']> {
  return {
    host: config.host,
    port: config.port,
    db: config.db,
    username: config.username,
    password: config.password,
    ...(config.tls ? { tls: config.tls } : {}),
  };
}
