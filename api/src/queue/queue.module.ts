import { BullModule } from '@nestjs/bull';
import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SCAN_QUEUE } from '@sixtyfold/shared';
import type { RedisConfig } from '../config/redis.config';
import { bullRedisOptions } from '../redis/redis-connection';
import { REDIS_CLIENT } from '../redis/redis.module';

/** The scan queue in the project's Redis; Redis carries the work, MariaDB keeps the record. */
@Module({
  imports: [
    BullModule.forRootAsync({
      // REDIS_CLIENT is injected only to wait for it: it has signed in with these credentials, so
      // a refused password stops the boot before bull starts retrying in the background.
      inject: [ConfigService, REDIS_CLIENT],
      useFactory: (config: ConfigService) => ({ redis: bullRedisOptions(config.getOrThrow<RedisConfig>('redis')) }),
    }),
    BullModule.registerQueue({ name: SCAN_QUEUE }),
  ],
  exports: [BullModule],
})
export class QueueModule {}
