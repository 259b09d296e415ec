import { pointRequest, scanPoints, type CreateScan } from '@sixtyfold/shared';
import { useEffect, useState } from 'react';

/** Points timed per estimate: enough to average out one slow point, few enough to feel instant. */
export const SAMPLE_POINTS = 6;
const DEBOUNCE_MS = 400;

export type RunEstimate =
  | { status: 'idle' }
  | { status: 'timing' }
  | { status: 'failed'; message: string }
  | {
      status: 'done';
      sampled: number;
      /** Engine time per point in this browser, in milliseconds. */
      msPerPoint: number;
      /** Sample points the engine could not evaluate, with the first reason. */
      failed: number;
      firstFailure: string | null;
    };

/** Point indices spread evenly over the grid, first and last included. */
export function sampleIndices(size: number, count = SAMPLE_POINTS): number[] {
  if (size <= count) return Array.from({ length: size }, (_, i) => i);
  return [...new Set(Array.from({ length: count }, (_, i) => Math.round((i * (size - 1)) / (count - 1))))];
}

/**
 * Times a few of the scan's own points with the shared engine in this browser, 400 ms after the
 * last edit, so the estimate follows the form without running on every keystroke. `spec` is null
 * while the form is invalid; `potentialSource` is what the API would store for the model.
 */
export function useRunEstimate(spec: CreateScan | null, potentialSource: string | null): RunEstimate {
  // The key carries the whole input: the effect re-runs only when something that matters changed.
  const key = spec && potentialSource ? JSON.stringify({ spec, potentialSource }) : null;
  const [result, setResult] = useState<{ key: string; estimate: RunEstimate } | null>(null);

  useEffect(() => {
    if (!key) return;
    let current = true;
    const timer = setTimeout(async () => {
      const { spec: s, potentialSource: source } = JSON.parse(key) as { spec: CreateScan; potentialSource: string };
      const points = scanPoints(s);
      const requests = sampleIndices(points.size).map((i) => pointRequest(s, source, points.point(i)));
      let estimate: RunEstimate;
      try {
        // The first point of a potential parses and compiles it (and warms the JIT): evaluate it
        // once untimed, so the cost per point is what the rest of a long scan pays.
        // Loaded on first use: the engine and its expression parser stay out of the main bundle.
        const { runEngine } = await import('@/lib/engine/run-engine');
        await runEngine(requests.slice(0, 1));
        const run = await runEngine(requests);
        const failures = run.results.filter((r) => r.status !== 'ok');
        estimate = {
          status: 'done',
          sampled: requests.length,
          msPerPoint: run.milliseconds / requests.length,
          failed: failures.length,
          firstFailure: failures[0]?.message ?? null,
        };
      } catch (error) {
        estimate = { status: 'failed', message: error instanceof Error ? error.message : String(error) };
      }
      if (current) setResult({ key, estimate });
    }, DEBOUNCE_MS);
    return () => {
      current = false;
      clearTimeout(timer);
    };
  }, [key]);

  if (!key) return { status: 'idle' };
  return result?.key === key ? result.estimate : { status: 'timing' };
}
