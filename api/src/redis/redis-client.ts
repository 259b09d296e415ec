import { Logger } from '@nestjs/common';
import { Redis, type RedisOptions } from 'ioredis';
import type { RedisConfig } from '../config/redis.config';

export type RedisClient = Redis;

/** Redis's answers to credentials it does not accept: retrying cannot help. */
const REFUSED_CREDENTIALS = /WRONGPASS|NOAUTH|NOPERM|invalid password|invalid username/i;
/** Node's TLS errors for a certificate it does not trust (wrong CA, wrong host name, expired). */
const REFUSED_CERTIFICATE = /CERT|SELF_SIGNED|UNABLE_TO_VERIFY|ERR_TLS/;

/** Why a first connection can never succeed as configured, or null when it is worth retrying. */
function permanentRefusal(err: Error & { code?: string }): string | null {
  if (REFUSED_CREDENTIALS.test(err.message)) return 'check the user and password in REDIS_URL';
  if (REFUSED_CERTIFICATE.test(err.code ?? '')) return 'check REDIS_TLS_CA_FILE, and that the certificate names the host in REDIS_URL';
  return null;
}

/** The connection settings every ioredis client takes: ours, and bull's own (ScanQueueModule). */
export function redisOptions(config: RedisConfig): RedisOptions {
  return {
    host: config.host,
    port: config.port,
    db: config.db,
    username: config.username,
    password: config.password,
    ...(config.tls ? { tls: config.tls } : {}),
  };
}

/**
 * Connects an ioredis client with the configured user, password, database and TLS, and resolves
 * once it is ready. A refusal of the credentials or of the server's certificate before the first
 * successful connection ends the attempt with the reason, so a misconfigured process stops at
 * boot instead of retrying forever; an unreachable server is waited for, and said so in the log.
 * Once connected, any later drop (Redis restarting) is retried.
 */
export async function createRedisClient(config: RedisConfig): Promise<RedisClient> {
  const logger = new Logger('Redis');
  const client = new Redis({
    ...redisOptions(config),
    lazyConnect: true,
    retryStrategy: (attempt: number) => Math.min(100 * 2 ** attempt, 3000),
  });
  await new Promise<void>((resolve, reject) => {
    const onError = (err: Error & { code?: string }) => {
      const reason = permanentRefusal(err);
      if (!reason) {
        logger.warn(`waiting for Redis at ${config.label}: ${err.message}`);
        return;
      }
      stopListening();
      client.disconnect();
      reject(new Error(`Redis at ${config.label} refused the connection: ${err.message} (${reason})`));
    };
    const onReady = () => {
      stopListening();
      resolve();
    };
    const stopListening = () => {
      client.off('error', onError);
      client.off('ready', onReady);
    };
    client.on('error', onError);
    client.on('ready', onReady);
    // ioredis rejects this at the first failed attempt even while it retries; the events above decide.
    client.connect().catch(() => undefined);
  });
  // Later errors (Redis restarting) are reconnected automatically and shown by the health check;
  // without a listener ioredis would print each one as unhandled.
  client.on('error', () => undefined);
  return client;
}
