import { Inject, Injectable } from '@nestjs/common';
import { WORKER_HEARTBEAT_PREFIX, workerHeartbeatSchema, type WorkerHeartbeat } from '@sixtyfold/shared';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';

@Injectable()
export class WorkersService {
  constructor(@Inject(REDIS_CLIENT) private readonly redis: RedisClient) {}

  /** Worker processes whose heartbeat has not expired, on any machine sharing this Redis. */
  async alive(): Promise<WorkerHeartbeat[]> {
    const keys: string[] = [];
    for await (const batch of this.redis.scanIterator({ MATCH: `${WORKER_HEARTBEAT_PREFIX}*`, COUNT: 200 })) {
      keys.push(...batch);
    }
    if (keys.length === 0) return [];
    const values = await this.redis.mGet(keys);
    return values
      .flatMap((raw) => {
        const parsed = raw ? workerHeartbeatSchema.safeParse(JSON.parse(raw)) : null;
        return parsed?.success ? [parsed.data] : [];
      })
      .sort((a, b) => a.id.localeCompare(b.id));
  }
}
