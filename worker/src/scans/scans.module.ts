import { BullModule } from '@nestjs/bull';
import { Module } from '@nestjs/common';
import { bullRedisOptions, readRedisConfig } from '@sixtyfold/api/database';
import { SCAN_QUEUE } from '@sixtyfold/shared';
import { readWorkerConfig } from '../config/worker.config';
import { HeartbeatModule } from '../heartbeat/heartbeat.module';
import { REDIS_CLIENT } from '../heartbeat/redis-client.provider';
import { ComputeChunkService } from './compute-chunk.service';
import { ScanChunkProcessor } from './scan-chunk.processor';

// Bull takes the queue's settings when the module is declared, so they are read from the environment here.
const { lockDurationMs } = readWorkerConfig();

@Module({
  imports: [
    BullModule.forRootAsync({
      // Waits for the heartbeat client, which has signed in with the same credentials: a refused
      // password stops the worker at boot instead of leaving bull retrying in the background.
      imports: [HeartbeatModule],
      inject: [REDIS_CLIENT],
      useFactory: () => ({ redis: bullRedisOptions(readRedisConfig()) }),
    }),
    BullModule.registerQueue({
      name: SCAN_QUEUE,
      // A running chunk renews its lock between points (ComputeChunkService), so the lock lapses
      // only when its worker is gone or hung: another worker's stall check, every stalledInterval,
      // then takes the chunk back, at most lockDuration + stalledInterval (35 s by default) after
      // the last renewal. A chunk that stalls more than maxStalledCount times fails for good.
      settings: { lockDuration: lockDurationMs, stalledInterval: 5_000, maxStalledCount: 3 },
    }),
    HeartbeatModule,
  ],
  providers: [ComputeChunkService, ScanChunkProcessor],
})
export class ScansModule {}
