import { BullModule } from '@nestjs/bull';
import { Module } from '@nestjs/common';
import { bullRedisOptions, readRedisConfig } from '@sixtyfold/api/database';
import { SCAN_QUEUE } from '@sixtyfold/shared';
import { HeartbeatModule } from '../heartbeat/heartbeat.module';
import { REDIS_CLIENT } from '../heartbeat/redis-client.provider';
import { ComputeChunkService } from './compute-chunk.service';
import { ScanChunkProcessor } from './scan-chunk.processor';

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
      // A chunk takes about a second and yields between points, so its lock renews in time; a
      // killed worker's chunk is taken back within lockDuration + stalledInterval (~20 s).
      settings: { lockDuration: 15_000, stalledInterval: 5_000, maxStalledCount: 3 },
    }),
    HeartbeatModule,
  ],
  providers: [ComputeChunkService, ScanChunkProcessor],
})
export class ScansModule {}
