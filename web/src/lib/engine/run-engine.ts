import { RequestEvaluator, type EvaluateRequest, type EvaluateResponse } from '@sixtyfold/shared';
import type { EngineJob, EngineReply } from './engine-protocol';

export interface EngineRun {
  results: EvaluateResponse[];
  milliseconds: number;
}

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, { resolve: (run: EngineRun) => void; reject: (error: Error) => void }>();

function engineWorker(): Worker {
  if (worker) return worker;
  worker = new Worker(new URL('./engine.worker.ts', import.meta.url), { type: 'module', name: 'sixtyfold-engine' });
  worker.onmessage = (event: MessageEvent<EngineReply>) => {
    const job = pending.get(event.data.id);
    pending.delete(event.data.id);
    job?.resolve({ results: event.data.results, milliseconds: event.data.milliseconds });
  };
  worker.onerror = (event) => {
    // A crashed worker fails everything in flight; the next call starts a fresh one.
    const error = new Error(`The in-browser engine stopped: ${event.message || 'unknown error'}`);
    for (const job of pending.values()) job.reject(error);
    pending.clear();
    worker?.terminate();
    worker = null;
  };
  return worker;
}

let inline: RequestEvaluator | null = null;

/**
 * Evaluates points with the shared engine in a Web Worker. Where no Worker exists (unit tests
 * under happy-dom) it evaluates on this thread: same engine, same results, only slower to paint.
 */
export function runEngine(requests: EvaluateRequest[]): Promise<EngineRun> {
  if (typeof Worker === 'undefined') {
    inline ??= new RequestEvaluator({ now: () => performance.now() });
    const started = performance.now();
    const results = requests.map((request) => inline!.evaluate(request));
    return Promise.resolve({ results, milliseconds: performance.now() - started });
  }
  const id = nextId++;
  const job: EngineJob = { id, requests };
  return new Promise<EngineRun>((resolve, reject) => {
    pending.set(id, { resolve, reject });
    engineWorker().postMessage(job);
  });
}

/** One point; the result says in `status` and `message` when the engine refused it. */
export async function runEnginePoint(request: EvaluateRequest): Promise<EvaluateResponse & { milliseconds: number }> {
  const run = await runEngine([request]);
  return { ...run.results[0], milliseconds: run.milliseconds };
}
