import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { CronJob } from 'cron';
import { readRedisConfig } from '../src/config/redis.config';
import { createRedisClient, type RedisClient } from '../src/redis/redis-client';
import { cronOccurrence } from '../src/scheduling/cron-occurrence';
import { RUN_CLAIM_PREFIX, ScheduledRunsService } from '../src/scheduling/scheduled-runs.service';

// Each API process has its own Redis connection; two services on two connections stand in for two processes.
describe('scheduled runs across API processes', () => {
  let clients: RedisClient[];
  let processes: ScheduledRunsService[];

  beforeAll(async () => {
    clients = await Promise.all([createRedisClient(readRedisConfig()), createRedisClient(readRedisConfig())]);
    processes = clients.map((c) => new ScheduledRunsService(c));
  });

  afterAll(async () => {
    for await (const keys of clients[0].scanStream({ match: `${RUN_CLAIM_PREFIX}test-*` })) if (keys.length) await clients[0].del(keys as string[]);
    await Promise.all(clients.map((c) => c.quit()));
  });

  it('gives each occurrence of a task to exactly one process', async () => {
    const task = `test-${process.pid}`;
    for (let occurrence = 1; occurrence <= 20; occurrence++) {
      const won = await Promise.all(processes.map((p) => p.claim(task, occurrence, 60_000)));
      expect(won.filter(Boolean)).toHaveLength(1);
    }
    // Asking again for a taken occurrence gets nothing; another task's same occurrence is free.
    expect(await processes[0].claim(task, 1, 60_000)).toBe(false);
    expect(await processes[1].claim(`${task}-other`, 1, 60_000)).toBe(true);
  });

  it('frees an occurrence once its claim has expired', async () => {
    const task = `test-${process.pid}-expiry`;
    expect(await processes[0].claim(task, 7, 50)).toBe(true);
    expect(await processes[1].claim(task, 7, 50)).toBe(false);
    await new Promise((r) => setTimeout(r, 150));
    expect(await processes[1].claim(task, 7, 50)).toBe(true);
  });

  it('names the same cron occurrence for a late tick and for a clock a little off', () => {
    const job = CronJob.from({ cronTime: '0 7 * * *', timeZone: 'UTC', onTick: () => undefined });
    const seven = Date.UTC(2026, 11, 4, 7, 0, 0);
    const ticks = [seven + 3, seven + 20_000, seven - 2_000];
    expect(ticks.map((t) => cronOccurrence(job, t))).toEqual([seven, seven, seven]);
    // The next day's tick is another occurrence.
    expect(cronOccurrence(job, seven + 24 * 3600_000 + 5)).toBe(seven + 24 * 3600_000);
    // A job every ten seconds tolerates up to half its period.
    const often = CronJob.from({ cronTime: '*/10 * * * * *', timeZone: 'UTC', onTick: () => undefined });
    expect(cronOccurrence(often, seven + 4_000)).toBe(seven);
    expect(cronOccurrence(often, seven - 4_000)).toBe(seven);
  });
});
