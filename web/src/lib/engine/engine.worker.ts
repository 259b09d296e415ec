/// <reference lib="webworker" />
import { RequestEvaluator } from '@sixtyfold/shared';
import type { EngineJob, EngineReply } from './engine-protocol';

// The same engine the workers run, off the main thread so the page stays responsive.
const evaluator = new RequestEvaluator();

self.onmessage = (event: MessageEvent<EngineJob>) => {
  const started = performance.now();
  const results = event.data.requests.map((request) => evaluator.evaluate(request));
  const reply: EngineReply = { id: event.data.id, results, milliseconds: performance.now() - started };
  self.postMessage(reply);
};
