import { Module } from '@nestjs/common';
import { HeartbeatService } from './heartbeat.service';

/** The heartbeat on the process's Redis connection (the global RedisModule). */
@Module({
  providers: [HeartbeatService],
  exports: [HeartbeatService],
})
export class HeartbeatModule {}
