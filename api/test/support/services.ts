import { readFileSync, rmSync } from 'node:fs';
import path from 'node:path';

// The fault tests stop and start the very MariaDB and Redis that `npm test` started, with the
// same scripts (deploy/scripts/lib), so a restarted server has exactly the settings it had.
const LIB = path.resolve('../deploy/scripts/lib');

interface Profile {
  dataDir: string;
  dbPort: number;
  redisPort: number;
  database: string;
  dbUser: string;
  dbPassword: string;
  manageDb: boolean;
  manageRedis: boolean;
}
interface Started {
  child: { unref(): void } | null;
  stop(): Promise<void>;
}
interface ServicesLib {
  startMariaDb(options: { dir: string; port: number; database: string; user: string; password: string }): Promise<Started>;
  startRedis(options: { dir: string; port: number }): Promise<Started>;
  stopByPidFile(pidFile: string, name: string): Promise<void>;
  isAlive(pid: number): boolean;
}

export interface TestServices {
  /** Stops MariaDB the way an operator would (SIGTERM, a clean shutdown) and waits until it has gone. */
  stopMariaDb(): Promise<void>;
  startMariaDb(): Promise<void>;
  /** Kills Redis with SIGKILL and deletes its append-only file: it comes back empty, as after losing its disk. */
  killRedisAndLoseData(): Promise<void>;
  startRedis(): Promise<void>;
}

export async function testServices(): Promise<TestServices> {
  const { resolveProfile } = (await import(path.join(LIB, 'environment.mjs'))) as { resolveProfile(name: string): Profile };
  const lib = (await import(path.join(LIB, 'services.mjs'))) as ServicesLib;
  const profile = resolveProfile('test');
  if (!profile.manageDb || !profile.manageRedis) {
    throw new Error('the fault tests stop and restart MariaDB and Redis, so they need the servers `npm test` starts itself (unset TEST_DATABASE_URL and TEST_REDIS_URL)');
  }
  const mariaDir = path.join(profile.dataDir, 'mariadb');
  const redisDir = path.join(profile.dataDir, 'redis');
  // Started from here, the servers must not keep jest's event loop alive.
  const detach = (started: Started) => started.child?.unref();
  return {
    stopMariaDb: () => lib.stopByPidFile(path.join(mariaDir, 'run', 'mysqld.pid'), 'MariaDB'),
    async startMariaDb() {
      detach(await lib.startMariaDb({ dir: mariaDir, port: profile.dbPort, database: profile.database, user: profile.dbUser, password: profile.dbPassword }));
    },
    async killRedisAndLoseData() {
      const pid = Number(readFileSync(path.join(redisDir, 'redis.pid'), 'utf8').trim());
      process.kill(pid, 'SIGKILL');
      while (lib.isAlive(pid)) await new Promise((r) => setTimeout(r, 50));
      rmSync(path.join(redisDir, 'aof'), { recursive: true, force: true });
    },
    async startRedis() {
      detach(await lib.startRedis({ dir: redisDir, port: profile.redisPort }));
    },
  };
}
