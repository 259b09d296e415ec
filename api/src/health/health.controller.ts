import { Controller, Get, Inject, ServiceUnavailableException } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { Public } from '../common/decorators/public.decorator';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';

/** Liveness of the API and its two services, for scripts, proxies and the start command. */
@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(REDIS_CLIENT) private readonly redis: RedisClient,
  ) {}

  @Public()
  @Get()
  @ApiOperation({ summary: 'Whether the API, MariaDB and Redis answer; no sign-in needed' })
  @ApiResponse({ status: 200, description: '`{ status: "ok", database: "up", redis: "up" }`' })
  @ApiResponse({ status: 503, description: 'MariaDB or Redis does not answer; `message` says which' })
  async check(): Promise<{ status: 'ok'; database: 'up'; redis: 'up' }> {
    const [database, redis] = await Promise.all([
      this.db.query('SELECT 1').then(() => true, () => false),
      this.redis.ping().then((p) => p === 'PONG', () => false),
    ]);
    if (!database || !redis) {
      throw new ServiceUnavailableException(
        `Not ready: database ${database ? 'up' : 'down'}, redis ${redis ? 'up' : 'down'}`,
      );
    }
    return { status: 'ok', database: 'up', redis: 'up' };
  }
}
