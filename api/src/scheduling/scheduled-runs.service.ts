import { Inject, Injectable, Logger } from '@nestjs/common';
import { CronJob } from 'cron';
import os from 'node:os';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';
import { cronOccurrence } from './cron-occurrence';

/** One key per task and occurrence; it only has to outlive the processes' disagreement about time. */
export const RUN_CLAIM_PREFIX = 'sixtyfold:runs:';
const CRON_CLAIM_TTL_MS = 10 * 60_000;

/**
 * Timed work that must happen once however many API processes run: every process keeps the
 * timer, and at each occurrence the one whose `SET key NX` succeeds does the work.
 */
@Injectable()
export class ScheduledRunsService {
  private readonly logger = new Logger('ScheduledRuns');
  private readonly owner = `${os.hostname()}:${process.pid}`;

  constructor(@Inject(REDIS_CLIENT) private readonly redis: RedisClient) {}

  /** True for exactly one of the processes that claim the same task and occurrence. */
  async claim(task: string, occurrence: number, ttlMs: number): Promise<boolean> {
    const answer = await this.redis.set(`${RUN_CLAIM_PREFIX}${task}:${occurrence}`, this.owner, 'PX', Math.max(1, Math.round(ttlMs)), 'NX');
    return answer === 'OK';
  }

  /** Runs `run` every `intervalMs` in one process: the occurrence is the interval's number since the epoch. */
  every(task: string, intervalMs: number, run: () => Promise<unknown>): NodeJS.Timeout {
    return setInterval(() => void this.runClaimed(task, Math.floor(Date.now() / intervalMs), 2 * intervalMs, run), intervalMs);
  }

  /** A started cron job each of whose occurrences runs `run` in one process. */
  cron(task: string, cronTime: string, timeZone: string | undefined, run: () => Promise<unknown>): CronJob {
    const job: CronJob = CronJob.from({
      cronTime,
      timeZone,
      onTick: () => void this.runClaimed(task, cronOccurrence(job), CRON_CLAIM_TTL_MS, run),
    });
    job.start();
    return job;
  }

  private async runClaimed(task: string, occurrence: number, ttlMs: number, run: () => Promise<unknown>): Promise<void> {
    let mine: boolean;
    try {
      mine = await this.claim(task, occurrence, ttlMs);
    } catch (err) {
      this.logger.warn(`${task} skipped: Redis did not answer the claim (${(err as Error).message})`);
      return;
    }
    // The work logs its own failures; this only keeps a rejection from going unhandled.
    if (mine) await run().catch((err: Error) => this.logger.warn(`${task} failed: ${err.message}`));
  }
}
