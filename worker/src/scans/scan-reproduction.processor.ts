import { OnQueueFailed, Process, Processor } from '@nestjs/bull';
import { Logger } from '@nestjs/common';
import type { Job } from 'bull';
import { REPRODUCE_POINTS_JOB, REPRODUCTION_QUEUE, reproducePointsJobSchema, type ReproducePointsJob } from '@sixtyfold/shared';
import { readWorkerConfig } from '../config/worker.config';
import { ReproducePointsService, type ReproductionOutcome } from './reproduce-points.service';

const { lockDurationMs } = readWorkerConfig();

/** Thin edge: re-validate the job data, recompute the sample, record a check that failed for good. */
@Processor(REPRODUCTION_QUEUE)
export class ScanReproductionProcessor {
  private readonly logger = new Logger('ScanReproductionProcessor');

  constructor(private readonly reproduce: ReproducePointsService) {}

  @Process({ name: REPRODUCE_POINTS_JOB, concurrency: 1 })
  async handle(job: Job<ReproducePointsJob>): Promise<ReproductionOutcome> {
    const data = reproducePointsJobSchema.parse(job.data);
    return this.reproduce.run(data, async () => {
      if (!(await job.extendLock(lockDurationMs))) throw new Error(`lost the lock on job ${job.id}; another worker took the check`);
    });
  }

  @OnQueueFailed()
  async onFailed(job: Job<ReproducePointsJob>, error: Error): Promise<void> {
    this.logger.warn(`job ${job.id} failed (attempt ${job.attemptsMade}): ${error.message}`);
    const state = await job.getState().catch(() => 'unknown');
    if (state !== 'failed') return;
    const data = reproducePointsJobSchema.safeParse(job.data);
    if (data.success) await this.reproduce.fail(data.data, `the workers could not recompute the sample: ${error.message}`).catch(() => undefined);
  }
}
