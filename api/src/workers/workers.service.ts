import { InjectQueue } from '@nestjs/bull';
import { Inject, Injectable } from '@nestjs/common';
import type { JobCounts, Queue } from 'bull';
import {
  SCAN_QUEUE, WORKER_HEARTBEAT_PREFIX, workerHeartbeatSchema, type ComputeChunkJob, type WorkerHeartbeat, type WorkerPool,
} from '@sixtyfold/shared';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';

@Injectable()
export class WorkersService {
  constructor(
    @Inject(REDIS_CLIENT) private readonly redis: RedisClient,
    @InjectQueue(SCAN_QUEUE) private readonly queue: Queue<ComputeChunkJob>,
  ) {}

  /** Worker processes whose heartbeat has not expired, on any machine sharing this Redis. */
  async alive(): Promise<WorkerHeartbeat[]> {
    const keys: string[] = [];
    for await (const batch of this.redis.scanStream({ match: `${WORKER_HEARTBEAT_PREFIX}*`, count: 200 })) {
      keys.push(...(batch as string[]));
    }
    if (keys.length === 0) return [];
    const values = await this.redis.mget(keys);
    return values
      .flatMap((raw) => {
        const parsed = raw ? workerHeartbeatSchema.safeParse(JSON.parse(raw)) : null;
        return parsed?.success ? [parsed.data] : [];
      })
      .sort((a, b) => a.id.localeCompare(b.id));
  }

  /** The live workers and the scan queue's chunk jobs by state (bull's own counts of its lists). */
  async pool(): Promise<WorkerPool> {
    const [workers, counts] = await Promise.all([this.alive(), this.queue.getJobCounts() as Promise<JobCounts & { paused?: number }>]);
    return {
      workers,
      // While the queue is paused, bull keeps its waiting jobs in a list of that name.
      queue: { waiting: counts.waiting + (counts.paused ?? 0), active: counts.active, delayed: counts.delayed, failed: counts.failed },
    };
  }
}
