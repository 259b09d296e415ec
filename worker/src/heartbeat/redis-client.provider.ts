import type { Provider } from '@nestjs/common';
import { connectRedis, readRedisConfig, type RedisClient } from '@sixtyfold/api/database';

export const REDIS_CLIENT = Symbol('REDIS_CLIENT');
export type { RedisClient };

/** Signs in at boot with REDIS_URL's user and password; a refusal stops the worker with Redis's answer. */
export const redisClientProvider: Provider = {
  provide: REDIS_CLIENT,
  useFactory: (): Promise<RedisClient> => connectRedis(readRedisConfig()),
};
