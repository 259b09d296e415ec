import type { Provider } from '@nestjs/common';
import { readRedisConfig } from '@sixtyfold/api/database';
import { createClient } from 'redis';

export const REDIS_CLIENT = Symbol('REDIS_CLIENT');
export type RedisClient = ReturnType<typeof createClient>;

export const redisClientProvider: Provider = {
  provide: REDIS_CLIENT,
  useFactory: async (): Promise<RedisClient> => {
    const client = createClient({ url: readRedisConfig().url });
    client.on('error', () => undefined); // reconnects by itself; heartbeats log the failures
    await client.connect();
    return client;
  },
};
