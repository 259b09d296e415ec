import type { EvaluateRequest, EvaluateResponse } from '@sixtyfold/shared';

/** A batch of engine requests sent to the engine's Web Worker, and what comes back. */
export interface EngineJob {
  id: number;
  requests: EvaluateRequest[];
}

export interface EngineReply {
  id: number;
  results: EvaluateResponse[];
  /** Wall time of the batch inside the worker, for run-time estimates. */
  milliseconds: number;
}
