import { Module } from '@nestjs/common';
import { ScheduledRunsService } from './scheduled-runs.service';

/** Timers that run once across all API processes (claims in Redis). */
@Module({
  providers: [ScheduledRunsService],
  exports: [ScheduledRunsService],
})
export class SchedulingModule {}
