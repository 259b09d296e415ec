import { BullModule } from '@nestjs/bull';
import { type DynamicModule, Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AdvancedSettings } from 'bull';
import { REPRODUCTION_QUEUE, SCAN_QUEUE } from '@sixtyfold/shared';
import type { RedisConfig } from '../config/redis.config';
import { redisOptions } from '../redis/redis-client';
import { REDIS_CLIENT } from '../redis/redis.module';

export interface ScanQueueOptions {
  /** Bull's settings for the processing side (lock duration, stall checks); the API only adds jobs and reads counts. */
  settings?: AdvancedSettings;
}

/**
 * The scan queue in the project's Redis, registered the same way by the API (which adds chunk
 * jobs) and the worker (which processes them); Redis carries the work, MariaDB keeps the record.
 * Import `register()` once per process, in its ScansModule; it is global, so other modules
 * (the API's worker pool) inject the queue without registering it again. Needs RedisModule.
 */
@Module({})
export class ScanQueueModule {
  static register(options: ScanQueueOptions = {}): DynamicModule {
    return {
      module: ScanQueueModule,
      global: true,
      imports: [
        BullModule.forRootAsync({
          // REDIS_CLIENT is injected only to wait for it: it has signed in with these credentials, so
          // a refused password stops the boot before bull starts retrying in the background.
          inject: [ConfigService, REDIS_CLIENT],
          useFactory: (config: ConfigService) => ({ redis: redisOptions(config.getOrThrow<RedisConfig>('redis')) }),
        }),
        BullModule.registerQueue(
          { name: SCAN_QUEUE, ...(options.settings ? { settings: options.settings } : {}) },
          // Reproducibility checks: their own queue, with the same settings (see reproduction-queue.ts).
          { name: REPRODUCTION_QUEUE, ...(options.settings ? { settings: options.settings } : {}) },
        ),
      ],
      exports: [BullModule],
    };
  }
}
