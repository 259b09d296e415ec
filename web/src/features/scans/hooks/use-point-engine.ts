import type { EvaluateRequest } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { runEnginePoint } from '@/lib/engine/run-engine';

type What = 'trajectory' | 'spectrum';

/**
 * A scan point evaluated again in the browser, with its trajectory or its spectrum. The engine is
 * pure, so a result never goes stale; it is kept while the page may come back to it.
 */
export const pointEngineQueryOptions = (scanId: number, pointIndex: number, request: EvaluateRequest | null, what: What) =>
  queryOptions({
    queryKey: ['engine', 'scan-point', scanId, pointIndex, what],
    queryFn: () => runEnginePoint({ ...request!, [what]: true }),
    enabled: request !== null,
    staleTime: Infinity,
    retry: false,
  });

export const usePointEngine = (scanId: number, pointIndex: number, request: EvaluateRequest | null, what: What, enabled = true) =>
  useQuery({ ...pointEngineQueryOptions(scanId, pointIndex, request, what), enabled: request !== null && enabled });
