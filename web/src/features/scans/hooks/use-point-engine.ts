import type { EvaluateRequest } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { runEnginePoint } from '@/lib/engine/run-engine';

type What = 'trajectory' | 'spectrum' | 'modes';

/** What each evaluation asks of the engine: the trajectory, the spectrum, or the point by the mode equations. */
const ASK: Record<What, Partial<EvaluateRequest>> = {
  trajectory: { trajectory: true },
  spectrum: { spectrum: true },
  modes: { method: 'exact' },
};

/**
 * A scan point evaluated again in the browser, with its trajectory, its spectrum, or by the exact
 * mode equations (to see how far slow roll is from them). The engine is pure, so a result never
 * goes stale; it is kept while the page may come back to it.
 */
export const pointEngineQueryOptions = (scanId: number, pointIndex: number, request: EvaluateRequest | null, what: What) =>
  queryOptions({
    queryKey: ['engine', 'scan-point', scanId, pointIndex, what],
    queryFn: () => runEnginePoint({ ...request!, ...ASK[what] }),
    enabled: request !== null,
    staleTime: Infinity,
    retry: false,
  });

export const usePointEngine = (scanId: number, pointIndex: number, request: EvaluateRequest | null, what: What, enabled = true) =>
  useQuery({ ...pointEngineQueryOptions(scanId, pointIndex, request, what), enabled: request !== null && enabled });
