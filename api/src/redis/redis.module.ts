import { Global, Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { RedisConfig } from '../config/redis.config';
import { createRedisClient, type RedisClient } from './redis-client';

export const REDIS_CLIENT = Symbol('REDIS_CLIENT');
export type { RedisClient };

/**
 * The process's one ioredis connection, signed in at boot: in the API for sessions, sign-in
 * limits, e-mail quotas, scheduled-run claims, the worker pool and health; in the worker for its
 * heartbeat. Bull opens its own connections with the same settings (ScanQueueModule). Needs the
 * `redis` config (redisConfig) loaded.
 */
@Global()
@Module({
  providers: [
    {
      provide: REDIS_CLIENT,
      inject: [ConfigService],
      useFactory: (config: ConfigService): Promise<RedisClient> => createRedisClient(config.getOrThrow<RedisConfig>('redis')),
    },
  ],
  exports: [REDIS_CLIENT],
})
export class RedisModule implements OnApplicationShutdown {
  constructor(@Inject(REDIS_CLIENT) private readonly client: RedisClient) {}

  // A global module shuts down after the modules that use it (the worker's heartbeat removes its key first).
  async onApplicationShutdown(): Promise<void> {
    if (this.client.status !== 'end') await this.client.quit().catch(() => this.client.disconnect());
  }
}
