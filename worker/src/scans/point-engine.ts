import { POINT_OUTPUTS, RequestEvaluator, type EvaluateResponse, type PointOutput } from '@sixtyfold/shared';
import type { WorkerConfig } from '../config/worker.config';

/**
 * The engine as this worker runs it for scan chunks and reproducibility checks alike. The engine has
 * no clock of its own; given this one, a point that runs past its wall-time limit ends as budget_exceeded.
 */
export function createPointEngine(worker: WorkerConfig): RequestEvaluator {
  return new RequestEvaluator({ now: () => performance.now(), budget: { wallTimeMs: worker.pointTimeLimitMs } });
}

/**
 * A point's outputs as `scan_points` keeps them: a number that is not finite (or absent) is NULL
 * there, so it is null here too, and a recomputed point compares with a stored one like for like.
 */
export function storedOutputs(result: EvaluateResponse): Record<PointOutput, number | null> {
  const outputs = {} as Record<PointOutput, number | null>;
  for (const output of POINT_OUTPUTS) {
    const value = result[output];
    outputs[output] = typeof value === 'number' && Number.isFinite(value) ? value : null;
  }
  return outputs;
}
