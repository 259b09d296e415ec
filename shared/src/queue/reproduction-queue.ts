import { z } from 'zod';

/**
 * The API ↔ worker contract for reproducibility checks: a queue of its own beside `scan-chunks`,
 * because bull adds up the concurrency of every named handler on one queue, and a second handler
 * there would let a worker run two chunks at once.
 */
export const REPRODUCTION_QUEUE = 'scan-reproductions';
export const REPRODUCE_POINTS_JOB = 'reproduce-points';

/** Job data: the check's id only; the worker reads the sample and the scan from MariaDB. */
export const reproducePointsJobSchema = z.object({
  scanId: z.number().int().positive(),
  reproductionId: z.number().int().positive(),
});
export type ReproducePointsJob = z.infer<typeof reproducePointsJobSchema>;

/** Deterministic job id, so enqueueing a check twice adds nothing: `scan-<id>-reproduction-<n>`. */
export function reproductionJobId(job: ReproducePointsJob): string {
  return `scan-${job.scanId}-reproduction-${job.reproductionId}`;
}

/** Attempts a check gets (with exponential back-off) before it is recorded as failed. */
export const REPRODUCTION_JOB_ATTEMPTS = 3;

/** The bull options of a check, the same wherever it is enqueued (a request, or a read that finds its job gone). */
export function reproductionJobOptions(job: ReproducePointsJob) {
  return {
    jobId: reproductionJobId(job),
    attempts: REPRODUCTION_JOB_ATTEMPTS,
    backoff: { type: 'exponential', delay: 2000 },
    removeOnComplete: true,
    removeOnFail: 1000,
  };
}
