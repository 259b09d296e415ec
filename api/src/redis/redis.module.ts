import { Global, Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { RedisConfig } from '../config/redis.config';
import { connectRedis, type RedisClient } from './redis-connection';

export const REDIS_CLIENT = Symbol('REDIS_CLIENT');
export type { RedisClient };

/** One node-redis connection for sessions, health checks and scheduled-run claims (bull keeps its own). */
@Global()
@Module({
  providers: [
    {
      provide: REDIS_CLIENT,
      inject: [ConfigService],
      useFactory: (config: ConfigService): Promise<RedisClient> => connectRedis(config.getOrThrow<RedisConfig>('redis')),
    },
  ],
  exports: [REDIS_CLIENT],
})
export class RedisModule implements OnApplicationShutdown {
  constructor(@Inject(REDIS_CLIENT) private readonly client: RedisClient) {}

  async onApplicationShutdown(): Promise<void> {
    if (this.client.isOpen) await this.client.close();
  }
}
