/// <reference lib="webworker" />
import { RequestEvaluator } from '@sixtyfold/shared';
import type { EngineJob, EngineReply } from './engine-protocol';

// The same engine the workers run, off the main thread so the page stays responsive.
// The same per-point budgets as the workers, wall time included (the engine has no clock of its own).
const evaluator = new RequestEvaluator({ now: () => performance.now() });

self.onmessage = (event: MessageEvent<EngineJob>) => {
  const started = performance.now();
  const results = event.data.requests.map((request) => evaluator.evaluate(request));
  const reply: EngineReply = { id: event.data.id, results, milliseconds: performance.now() - started };
  self.postMessage(reply);
};
