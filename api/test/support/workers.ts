import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

/** The built worker, started as operators start it. */
export const WORKER_MAIN = path.resolve('../worker/dist/main.js');

/** Starts `count` real worker processes with the test environment, `env` overriding settings. */
export function startWorkers(count: number, env: Record<string, string> = {}): ChildProcess[] {
  return Array.from({ length: count }, () => spawn(process.execPath, [WORKER_MAIN], { env: { ...process.env, ...env }, stdio: 'ignore' }));
}

/** SIGTERM to each worker, resolved once all have exited (they finish their active chunk first). */
export function stopWorkers(workers: ChildProcess[]): Promise<void[]> {
  return Promise.all(workers.map((w) => new Promise<void>((resolve) => {
    if (w.exitCode !== null) return resolve();
    w.once('exit', () => resolve());
    w.kill('SIGTERM');
  })));
}
