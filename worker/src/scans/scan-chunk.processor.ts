import { OnQueueFailed, OnQueueStalled, Process, Processor } from '@nestjs/bull';
import { Logger } from '@nestjs/common';
import type { Job } from 'bull';
import { COMPUTE_CHUNK_JOB, computeChunkJobSchema, SCAN_QUEUE, type ComputeChunkJob } from '@sixtyfold/shared';
import { readWorkerConfig } from '../config/worker.config';
import { HeartbeatService } from '../heartbeat/heartbeat.service';
import { ComputeChunkService, type ChunkOutcome } from './compute-chunk.service';

// Bull takes the concurrency when the processor is declared, so it is read from the environment here.
const { concurrency } = readWorkerConfig();

/** Thin edge: re-validate the job data, compute, report. Failures per point are data, not errors. */
@Processor(SCAN_QUEUE)
export class ScanChunkProcessor {
  private readonly logger = new Logger('ScanChunkProcessor');

  constructor(
    private readonly compute: ComputeChunkService,
    private readonly heartbeat: HeartbeatService,
  ) {}

  @Process({ name: COMPUTE_CHUNK_JOB, concurrency })
  async handle(job: Job<ComputeChunkJob>): Promise<ChunkOutcome> {
    const data = computeChunkJobSchema.parse(job.data);
    const outcome = await this.compute.run(data, (fraction) => job.progress(Math.round(fraction * 100)));
    await job.progress(100);
    if (!outcome.skipped) {
      this.heartbeat.recordChunk(outcome.computed + outcome.failed);
      await this.heartbeat.beat().catch(() => undefined);
    }
    return outcome;
  }

  @OnQueueFailed()
  onFailed(job: Job<ComputeChunkJob>, error: Error): void {
    this.logger.warn(`job ${job.id} failed (attempt ${job.attemptsMade}): ${error.message}`);
  }

  @OnQueueStalled()
  onStalled(job: Job<ComputeChunkJob>): void {
    this.logger.warn(`job ${job.id} stalled; another worker will take it`);
  }
}
