import { registerAs } from '@nestjs/config';
import { z } from 'zod';

/**
 * A chunk renews its bull lock between points whenever this long has passed since the last
 * renewal. While a point computes the event loop is blocked, so the lock can go unrenewed for
 * at most one point (its wall-time limit) plus this interval: that sum must stay below the lock
 * duration, which is checked here at boot.
 */
export const LOCK_RENEWAL_SECONDS = 2;

const schema = z.object({
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
  /** Wall time one point may compute before it ends as budget_exceeded. */
  WORKER_POINT_TIME_LIMIT_SECONDS: z.coerce.number().positive().max(3600).default(20),
  /** Bull's lock on a running chunk; a killed worker's chunk is taken back at most this long (plus a stall check) after its last renewal. */
  WORKER_LOCK_SECONDS: z.coerce.number().positive().max(3600).default(30),
  /** A chunk that has computed this long stores what it has and hands the rest back to the queue. */
  WORKER_SLICE_SECONDS: z.coerce.number().positive().max(86_400).default(30),
});

export interface WorkerConfig {
  concurrency: number;
  pointTimeLimitMs: number;
  lockDurationMs: number;
  sliceMs: number;
}

export function readWorkerConfig(env: NodeJS.ProcessEnv = process.env): WorkerConfig {
  const result = schema
    .refine((c) => c.WORKER_POINT_TIME_LIMIT_SECONDS + LOCK_RENEWAL_SECONDS < c.WORKER_LOCK_SECONDS, {
      path: ['WORKER_LOCK_SECONDS'],
      message: `must be more than WORKER_POINT_TIME_LIMIT_SECONDS + ${LOCK_RENEWAL_SECONDS} s (the longest a chunk goes without renewing its lock)`,
    })
    .safeParse(env);
  if (!result.success) {
    throw new Error(`Invalid worker configuration: ${result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  }
  const c = result.data;
  return {
    concurrency: c.WORKER_CONCURRENCY,
    pointTimeLimitMs: c.WORKER_POINT_TIME_LIMIT_SECONDS * 1000,
    lockDurationMs: c.WORKER_LOCK_SECONDS * 1000,
    sliceMs: c.WORKER_SLICE_SECONDS * 1000,
  };
}

export const workerConfig = registerAs('worker', () => readWorkerConfig());
