import type { WorkerPool } from '@sixtyfold/shared';

/** Points the pool can compute at once: each live process runs `concurrency` chunks side by side. */
export function workerSlots(pool: WorkerPool): number {
  return pool.workers.reduce((sum, worker) => sum + worker.concurrency, 0);
}
