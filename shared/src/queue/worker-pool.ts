import { z } from 'zod';

/**
 * Each worker process keeps a key `${WORKER_HEARTBEAT_PREFIX}<host>:<pid>` alive in Redis;
 * the API lists these keys to show the pool. A key that expires is a worker that died.
 */
export const WORKER_HEARTBEAT_PREFIX = 'sixtyfold:workers:';
export const WORKER_HEARTBEAT_INTERVAL_MS = 5_000;
export const WORKER_HEARTBEAT_TTL_SECONDS = 15;

export const workerHeartbeatSchema = z.object({
  id: z.string(),
  host: z.string(),
  pid: z.number().int(),
  concurrency: z.number().int(),
  startedAt: z.string(),
  lastSeenAt: z.string(),
  /** Work this process has finished since it started. */
  chunksDone: z.number().int().default(0),
  pointsDone: z.number().int().default(0),
});
export type WorkerHeartbeat = z.infer<typeof workerHeartbeatSchema>;

const count = z.number().int();

/** `GET /api/workers/pool`: the live workers and the scan queue's job counts, at one glance. */
export const workerPoolSchema = z.object({
  workers: z.array(workerHeartbeatSchema),
  queue: z.object({ waiting: count, active: count, delayed: count, failed: count }),
});
export type WorkerPool = z.infer<typeof workerPoolSchema>;
