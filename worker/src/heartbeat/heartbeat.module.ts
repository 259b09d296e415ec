import { Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { HeartbeatService } from './heartbeat.service';
import { REDIS_CLIENT, redisClientProvider, type RedisClient } from './redis-client.provider';

@Module({
  providers: [redisClientProvider, HeartbeatService],
  exports: [HeartbeatService, REDIS_CLIENT],
})
export class HeartbeatModule implements OnApplicationShutdown {
  constructor(@Inject(REDIS_CLIENT) private readonly redis: RedisClient) {}

  async onApplicationShutdown(): Promise<void> {
    if (this.redis.isOpen) await this.redis.close();
  }
}
