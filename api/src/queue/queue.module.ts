import { BullModule } from '@nestjs/bull';
import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SCAN_QUEUE } from '@sixtyfold/shared';
import type { RedisConfig } from '../config/redis.config';

/** The scan queue in the project's Redis; Redis carries the work, MariaDB keeps the record. */
@Module({
  imports: [
    BullModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => {
        const { host, port, db, password } = config.getOrThrow<RedisConfig>('redis');
        return { redis: { host, port, db, password } };
      },
    }),
    BullModule.registerQueue({ name: SCAN_QUEUE }),
  ],
  exports: [BullModule],
})
export class QueueModule {}
