// Starts the API and the worker processes of a profile and keeps the workers running.
import { spawn } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import { ROOT } from './environment.mjs';
import { log } from './output.mjs';
import { stopChild } from './services.mjs';

function prefixLines(stream, label, out) {
  let buffer = '';
  stream.setEncoding('utf8');
  stream.on('data', (chunk) => {
    buffer += chunk;
    const lines = buffer.split('\n');
    buffer = lines.pop();
    for (const line of lines) out.write(`${label} ${line}\n`);
  });
}

function startNode(script, label, env, { quiet = false } = {}) {
  const child = spawn(process.execPath, [script], {
    cwd: path.dirname(path.dirname(script)),
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true, // Ctrl-C reaches the parent only, which stops everything in order
  });
  if (quiet) {
    child.stdout.resume();
    prefixLines(child.stderr, label, process.stderr);
  } else {
    prefixLines(child.stdout, label, process.stdout);
    prefixLines(child.stderr, label, process.stderr);
  }
  return child;
}

const WORKER_NICENESS = 10;

/**
 * The API plus `count` workers. A worker that dies is started again after a pause, the way a
 * process manager would; `stop()` ends them all (SIGTERM, then SIGKILL after a grace period).
 */
export function startAppProcesses({ env, workers: count, quiet = false }) {
  let stopping = false;
  const api = startNode(path.join(ROOT, 'api/dist/main.js'), '[api]', env, { quiet });
  const workers = [];
  const launchWorker = (i) => {
    const child = startNode(path.join(ROOT, 'worker/dist/main.js'), `[worker-${i + 1}]`, env, { quiet });
    // Workers compute flat out; at a lower priority they leave the API the moments it needs to
    // answer (progress polls, sign-in) on the same cores, and still get every idle cycle.
    try {
      os.setPriority(child.pid, WORKER_NICENESS);
    } catch {
      // not permitted here: the workers run at the API's priority
    }
    workers[i] = child;
    child.once('exit', (code, signal) => {
      if (stopping) return;
      log(`worker ${i + 1} exited (${signal ?? code}); starting it again in 2 s`);
      setTimeout(() => { if (!stopping) launchWorker(i); }, 2000);
    });
  };
  for (let i = 0; i < count; i++) launchWorker(i);
  return {
    api,
    workers,
    async stop() {
      stopping = true;
      await Promise.all([stopChild(api, 'API'), ...workers.map((w, i) => stopChild(w, `worker ${i + 1}`))]);
    },
  };
}

/** Polls the API's health route until it answers 200. */
export async function waitForApi(port, child, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) return false;
    try {
      const res = await fetch(`http://127.0.0.1:${port}/api/health`);
      if (res.ok) return true;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  return false;
}
