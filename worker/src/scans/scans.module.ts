import { Module } from '@nestjs/common';
import { ScanQueueModule } from '@sixtyfold/api/queue';
import { readWorkerConfig } from '../config/worker.config';
import { HeartbeatModule } from '../heartbeat/heartbeat.module';
import { ComputeChunkService } from './compute-chunk.service';
import { ScanChunkProcessor } from './scan-chunk.processor';
import { ReproducePointsService } from './reproduce-points.service';
import { ScanReproductionProcessor } from './scan-reproduction.processor';

// Bull takes the queue's settings when the module is declared, so they are read from the environment here.
const { lockDurationMs } = readWorkerConfig();

@Module({
  imports: [
    ScanQueueModule.register({
      // A running chunk renews its lock between points (ComputeChunkService), so the lock lapses
      // only when its worker is gone or hung: another worker's stall check, every stalledInterval,
      // then takes the chunk back, at most lockDuration + stalledInterval (35 s by default) after
      // the last renewal. A chunk that stalls more than maxStalledCount times fails for good.
      settings: { lockDuration: lockDurationMs, stalledInterval: 5_000, maxStalledCount: 3 },
    }),
    HeartbeatModule,
  ],
  providers: [ComputeChunkService, ScanChunkProcessor, ReproducePointsService, ScanReproductionProcessor],
})
export class ScansModule {}
