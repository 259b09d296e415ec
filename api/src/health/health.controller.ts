import { Controller, Get, Inject, ServiceUnavailableException } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { Public } from '../common/decorators/public.decorator';
import { DatabasePoolService, type PoolFigures } from '../database/database-pool.service';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';

/** Each check gets this long; health answers within it whatever the pool or Redis do. */
const CHECK_MS = 800;

function within<T>(promise: Promise<T>): Promise<T> {
  return Promise.race([promise, new Promise<T>((_, reject) => setTimeout(() => reject(new Error('no answer in time')), CHECK_MS).unref())]);
}

export interface Health {
  status: 'ok' | 'saturated';
  database: 'up' | 'saturated';
  redis: 'up';
  pool: PoolFigures;
}

/** Liveness of the API and its two services, for scripts, proxies and the start command. */
@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(REDIS_CLIENT) private readonly redis: RedisClient,
    private readonly pool: DatabasePoolService,
  ) {}

  @Public()
  @Get()
  @ApiOperation({ summary: 'Whether the API, MariaDB and Redis answer, with the database pool\'s figures; no sign-in needed' })
  @ApiResponse({
    status: 200,
    description: '`{ status: "ok", database: "up", redis: "up", pool: { size, inUse, free, queued } }`; `status` and `database` are ' +
      '`"saturated"` while every pooled connection is in use (requests wait, then answer 503)',
  })
  @ApiResponse({ status: 503, description: 'MariaDB or Redis does not answer; `message` says which' })
  async check(): Promise<Health> {
    const pool = this.pool.figures();
    // With every connection lent out, a test query would only queue: the busy pool is the answer.
    const saturated = pool.free === 0;
    const [database, redis] = await Promise.all([
      saturated ? true : within(this.db.query('SELECT 1')).then(() => true, () => false),
      within(this.redis.ping()).then((p) => p === 'PONG', () => false),
    ]);
    if (!database || !redis) {
      throw new ServiceUnavailableException(`Not ready: database ${database ? 'up' : 'down'}, redis ${redis ? 'up' : 'down'}`);
    }
    return saturated ? { status: 'saturated', database: 'saturated', redis: 'up', pool } : { status: 'ok', database: 'up', redis: 'up', pool };
  }
}
