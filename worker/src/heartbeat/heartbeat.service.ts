import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import os from 'node:os';
import {
  WORKER_HEARTBEAT_INTERVAL_MS, WORKER_HEARTBEAT_PREFIX, WORKER_HEARTBEAT_TTL_SECONDS, type WorkerHeartbeat,
} from '@sixtyfold/shared';
import type { WorkerConfig } from '../config/worker.config';
import { REDIS_CLIENT, type RedisClient } from '@sixtyfold/api/queue';

/** Announces this process to the pool while it runs, and withdraws it on a clean stop. */
@Injectable()
export class HeartbeatService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('Heartbeat');
  private readonly id = `${os.hostname()}:${process.pid}`;
  private readonly startedAt = new Date().toISOString();
  private timer: NodeJS.Timeout | undefined;
  private chunksDone = 0;
  private pointsDone = 0;

  constructor(
    @Inject(REDIS_CLIENT) private readonly redis: RedisClient,
    private readonly config: ConfigService,
  ) {}

  get key(): string {
    return WORKER_HEARTBEAT_PREFIX + this.id;
  }

  async onApplicationBootstrap(): Promise<void> {
    await this.beat();
    this.timer = setInterval(() => {
      this.beat().catch((err: Error) => this.logger.warn(`heartbeat failed: ${err.message}`));
    }, WORKER_HEARTBEAT_INTERVAL_MS);
    this.logger.log(`worker ${this.id} joined the pool`);
  }

  async onApplicationShutdown(): Promise<void> {
    clearInterval(this.timer);
    // RedisModule is global, so its connection closes after this.
    await this.redis.del(this.key).catch(() => undefined);
  }

  /** Counts a finished chunk; the pool view shows how the work spreads over processes. */
  recordChunk(points: number): void {
    this.chunksDone++;
    this.pointsDone += points;
  }

  async beat(): Promise<void> {
    const { concurrency, lockDurationMs } = this.config.getOrThrow<WorkerConfig>('worker');
    const beat: WorkerHeartbeat = {
      id: this.id,
      host: os.hostname(),
      pid: process.pid,
      concurrency,
      startedAt: this.startedAt,
      lastSeenAt: new Date().toISOString(),
      chunksDone: this.chunksDone,
      pointsDone: this.pointsDone,
    };
    // One point blocks the timer for up to its time limit, which the lock duration bounds: the key outlives that.
    const ttl = Math.max(WORKER_HEARTBEAT_TTL_SECONDS, Math.ceil(lockDurationMs / 1000) + 5);
    await this.redis.set(this.key, JSON.stringify(beat), 'EX', ttl);
  }
}
