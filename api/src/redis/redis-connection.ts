import { Logger } from '@nestjs/common';
import type { QueueOptions } from 'bull';
import { createClient } from 'redis';
import type { RedisConfig } from '../config/redis.config';

export type RedisClient = ReturnType<typeof createClient>;

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

/**
 * Connects a node-redis client with the configured user, password and TLS. A refusal of the
 * credentials or of the server's certificate before the first successful connection ends the
 * attempt with the reason, so a misconfigured process stops at boot instead of retrying forever;
 * an unreachable server is waited for (and said so). Once connected, any later drop (Redis
 * restarting) is retried as before.
 */
export async function connectRedis(config: RedisConfig): Promise<RedisClient> {
  const logger = new Logger('Redis');
  let connected = false;
  const client = createClient({
    url: config.url,
    socket: {
      ...(config.tls ? { tls: true as const, ...config.tls } : {}),
      reconnectStrategy: (retries: number, cause: Error) =>
        !connected && permanentRefusal(cause) ? cause : Math.min(100 * 2 ** retries, 3000),
    },
  });
  client.on('error', (err: Error) => {
    // Errors while Redis restarts later are logged by the health check; reconnection is automatic.
    if (!connected && !permanentRefusal(err)) logger.warn(`waiting for Redis at ${config.label}: ${err.message}`);
  });
  client.on('ready', () => (connected = true));
  try {
    await client.connect();
  } catch (err) {
    // node-redis wraps the refusal that ended the attempt (a ReconnectStrategyError's socketError).
    const cause = (err as { socketError?: Error }).socketError ?? (err as Error);
    const reason = permanentRefusal(cause);
    throw new Error(`Redis at ${config.label} refused the connection: ${cause.message}${reason ? ` (${reason})` : ''}`);
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
