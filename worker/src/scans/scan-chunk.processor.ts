import { InjectQueue, OnQueueFailed, OnQueueStalled, Process, Processor } from '@nestjs/bull';
import { Logger } from '@nestjs/common';
import type { Job, Queue } from 'bull';
import { chunkJobOptions, COMPUTE_CHUNK_JOB, computeChunkJobSchema, SCAN_QUEUE, type ComputeChunkJob } from '@sixtyfold/shared';
import { readWorkerConfig } from '../config/worker.config';
import { HeartbeatService } from '../heartbeat/heartbeat.service';
import { ComputeChunkService, type ChunkOutcome } from './compute-chunk.service';

// Bull takes the concurrency when the processor is declared, so it is read from the environment here.
const { concurrency, lockDurationMs } = readWorkerConfig();

/** Thin edge: re-validate the job data, compute, report. Failures per point are data, not errors. */
@Processor(SCAN_QUEUE)
export class ScanChunkProcessor {
  private readonly logger = new Logger('ScanChunkProcessor');

  constructor(
    private readonly compute: ComputeChunkService,
    private readonly heartbeat: HeartbeatService,
    @InjectQueue(SCAN_QUEUE) private readonly queue: Queue<ComputeChunkJob>,
  ) {}

  @Process({ name: COMPUTE_CHUNK_JOB, concurrency })
  async handle(job: Job<ComputeChunkJob>): Promise<ChunkOutcome> {
    const data = computeChunkJobSchema.parse(job.data);
    const outcome = await this.compute.run(data, async (fraction) => {
      // 0: the lock is no longer ours (it lapsed and another worker may hold the chunk): stop here.
      if (!(await job.extendLock(lockDurationMs))) throw new Error(`lost the lock on job ${job.id}; its chunk was handed to another worker`);
      await job.progress(Math.round(fraction * 100));
    });
    // Handed on before this job completes, so the chunk is on the queue at every moment (the reconciler relies on it).
    if (outcome.rest) await this.queue.add(COMPUTE_CHUNK_JOB, outcome.rest, chunkJobOptions(outcome.rest));
    await job.progress(100);
    if (!outcome.skipped) {
      this.heartbeat.recordChunk(outcome.computed + outcome.failed);
      await this.heartbeat.beat().catch(() => undefined);
    }
    return outcome;
  }

  /** A job bull gives up on (attempts used up, or stalled too often) has its missing points stored as failures, so the scan can finish. */
  @OnQueueFailed()
  async onFailed(job: Job<ComputeChunkJob>, error: Error): Promise<void> {
    this.logger.warn(`job ${job.id} failed (attempt ${job.attemptsMade}): ${error.message}`);
    try {
      // 'delayed' or 'waiting': bull tries it again.
      if ((await job.getState()) !== 'failed') return;
      const data = computeChunkJobSchema.parse(job.data);
      // A chunk that stalled too often failed without a counted attempt; bull's message says so.
      const attempts = job.attemptsMade === 0 ? '' : job.attemptsMade === 1 ? ' after 1 attempt' : ` after ${job.attemptsMade} attempts`;
      const reason = `the workers could not compute points ${data.start}–${data.end - 1}: ${error.message}${attempts}`;
      const written = await this.compute.storeGivenUp(data, reason);
      this.logger.warn(`job ${job.id} given up: ${written} point(s) stored as chunk_failed`);
    } catch (err) {
      // The reconciler re-queues the chunk later, since its points are still missing.
      this.logger.error(`job ${job.id}: its points could not be stored as failed: ${(err as Error).message}`);
    }
  }

  @OnQueueStalled()
  onStalled(job: Job<ComputeChunkJob>): void {
    this.logger.warn(`job ${job.id} stalled; another worker will take it`);
  }
}
