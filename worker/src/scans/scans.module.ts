import { BullModule } from '@nestjs/bull';
import { Module } from '@nestjs/common';
import { readRedisConfig } from '@sixtyfold/api/database';
import { SCAN_QUEUE } from '@sixtyfold/shared';
import { HeartbeatModule } from '../heartbeat/heartbeat.module';
import { ComputeChunkService } from './compute-chunk.service';
import { ScanChunkProcessor } from './scan-chunk.processor';

@Module({
  imports: [
    BullModule.forRootAsync({
      useFactory: () => {
        const { host, port, db, password } = readRedisConfig();
        return { redis: { host, port, db, password } };
      },
    }),
    BullModule.registerQueue({ name: SCAN_QUEUE }),
    HeartbeatModule,
  ],
  providers: [ComputeChunkService, ScanChunkProcessor],
})
export class ScansModule {}
