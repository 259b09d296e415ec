import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn, type ChildProcess } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import { Redis } from 'ioredis';
import { WORKER_HEARTBEAT_PREFIX, workerHeartbeatSchema } from '@sixtyfold/shared';
import { eventually } from './support/eventually';

// Real worker processes from the build (`npm test` builds first), on the test Redis and MariaDB.
const WORKER_MAIN = path.resolve('dist/main.js');

function startWorker(concurrency: number): ChildProcess {
  return spawn(process.execPath, [WORKER_MAIN], {
    env: { ...process.env, WORKER_CONCURRENCY: String(concurrency) },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
}


describe('worker pool membership', () => {
  // The test profile's Redis. Not through createRedisClient: the API's build requires Nest packages,
  // which are ES modules that jest cannot require on Node 20.
  const redis = new Redis(process.env.REDIS_URL!, { lazyConnect: true });
  const workers: ChildProcess[] = [];

  beforeAll(async () => {
    await redis.connect();
  });
  afterAll(async () => {
    for (const w of workers) if (w.exitCode === null) w.kill('SIGKILL');
    await redis.quit();
  });

  it('two processes join the pool with their settings, and a clean stop leaves it', async () => {
    workers.push(startWorker(2), startWorker(3));
    const keys = workers.map((w) => `${WORKER_HEARTBEAT_PREFIX}${os.hostname()}:${w.pid}`);
    const beats = await eventually(async () => {
      const values = await redis.mget(keys);
      return values.every(Boolean) ? values.map((v) => workerHeartbeatSchema.parse(JSON.parse(v!))) : undefined;
    }, 'both heartbeats');
    expect(beats.map((b) => [b.pid, b.concurrency])).toEqual([[workers[0].pid, 2], [workers[1].pid, 3]]);
    const ttl = await redis.ttl(keys[0]);
    expect(ttl).toBeGreaterThan(0);
    // The key outlives one point's time limit: the lock duration (30 s by default) plus 5 s.
    expect(ttl).toBeGreaterThan(30);
    expect(ttl).toBeLessThanOrEqual(35);

    const exited = new Promise<string>((resolve) => workers[0].once('exit', (code, signal) => resolve(signal ?? String(code))));
    workers[0].kill('SIGTERM');
    // Nest runs its shutdown hooks, then re-raises the signal: a clean stop ends by SIGTERM.
    expect(await exited).toBe('SIGTERM');
    expect(await redis.exists(keys[0])).toBe(0);
    expect(await redis.exists(keys[1])).toBe(1);
  });

  it('refuses to start with a bad configuration and says why', async () => {
    const cases: [Record<string, string>, RegExp][] = [
      [{ WORKER_CONCURRENCY: 'lots' }, /WORKER_CONCURRENCY/],
      // A point could then hold the event loop until the chunk's lock lapsed.
      [{ WORKER_POINT_TIME_LIMIT_SECONDS: '20', WORKER_LOCK_SECONDS: '21' }, /WORKER_LOCK_SECONDS: must be more than WORKER_POINT_TIME_LIMIT_SECONDS \+ 2 s/],
    ];
    for (const [env, reason] of cases) {
      const child = spawn(process.execPath, [WORKER_MAIN], { env: { ...process.env, ...env }, stdio: ['ignore', 'ignore', 'pipe'] });
      let stderr = '';
      child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()));
      const code = await new Promise<number | null>((resolve) => child.once('exit', resolve));
      expect(code).not.toBe(0);
      expect(stderr).toMatch(reason);
    }
  });
});
