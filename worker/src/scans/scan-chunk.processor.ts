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
    try {
      return await this.computeAndHandOn(job, data);
    } catch (err) {
      // The last attempt stores its points as failed while it still holds the job, so at no
      // moment is the chunk both off the queue and missing from the scan (the reconciler would
      // queue it again).
      if (job.attemptsMade + 1 >= (job.opts.attempts ?? 1)) await this.giveUp(job, data, err as Error, job.attemptsMade + 1);
      throw err;
    }
  }

  private async computeAndHandOn(job: Job<ComputeChunkJob>, data: ComputeChunkJob): Promise<ChunkOutcome> {
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

  /**
   * A job bull gives up on for stalling too often (its worker died or hung each time) fails
   * without an attempt of its own: its missing points are stored as failed here, by whichever
   * worker's stall check noticed. (The store adds only missing points, so after a last attempt
   * that stored them already it writes nothing.)
   */
  @OnQueueFailed()
  async onFailed(job: Job<ComputeChunkJob>, error: Error): Promise<void> {
    this.logger.warn(`job ${job.id} failed (attempt ${job.attemptsMade}): ${error.message}`);
    // 'delayed' or 'waiting': bull tries it again.
    const state = await job.getState().catch(() => 'unknown');
    if (state !== 'failed') return;
    const data = computeChunkJobSchema.safeParse(job.data);
    if (data.success) await this.giveUp(job, data.data, error, job.attemptsMade);
  }

  /** Stores the job's missing points as `chunk_failed`, saying what happened, so the scan can finish. */
  private async giveUp(job: Job<ComputeChunkJob>, data: ComputeChunkJob, error: Error, attempts: number): Promise<void> {
    const tries = attempts === 0 ? '' : attempts === 1 ? ' after 1 attempt' : ` after ${attempts} attempts`;
    const reason = `the workers could not compute points ${data.start}–${data.end - 1}: ${error.message}${tries}`;
    try {
      const written = await this.compute.storeGivenUp(data, reason);
      if (written > 0) this.logger.warn(`job ${job.id} given up: ${written} point(s) stored as chunk_failed`);
    } catch (err) {
      // Still missing, so the reconciler queues the chunk again later.
      this.logger.error(`job ${job.id} given up, but its points could not be stored as failed: ${(err as Error).message}`);
    }
  }

  @OnQueueStalled()
  onStalled(job: Job<ComputeChunkJob>): void {
    this.logger.warn(`job ${job.id} stalled; another worker will take it`);
  }
}
