import { refinementEstimateSchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

type EstimateQuery = Record<string, string | number | undefined>;

export const getRefineEstimate = (scanId: number, query: EstimateQuery, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/refine/estimate`, { schema: refinementEstimateSchema, query, signal });

export const getRefineEstimateQueryOptions = (scanId: number, query: EstimateQuery) =>
  queryOptions({
    queryKey: ['scans', 'refine-estimate', scanId, query],
    queryFn: ({ signal }) => getRefineEstimate(scanId, query, signal),
    placeholderData: keepPreviousData,
    retry: false,
  });

/** The first level's points and time, asked again as the settings change; off while they are incomplete (`query` null). */
export const useRefineEstimate = (scanId: number, query: EstimateQuery | null) =>
  useQuery({ ...getRefineEstimateQueryOptions(scanId, query ?? {}), enabled: query !== null });
