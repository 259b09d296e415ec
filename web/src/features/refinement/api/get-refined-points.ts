import { refinedPointPageSchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const REFINED_POINTS_PAGE_SIZE = 50;

export const getRefinedPoints = (scanId: number, page: number, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/refinement/points`, { schema: refinedPointPageSchema, query: { page, pageSize: REFINED_POINTS_PAGE_SIZE }, signal });

export const getRefinedPointsQueryOptions = (scanId: number, page: number) =>
  queryOptions({
    queryKey: ['scans', 'refined-points', scanId, page],
    queryFn: ({ signal }) => getRefinedPoints(scanId, page, signal),
    placeholderData: keepPreviousData,
  });

/** Asked only once a level has completed (`enabled`): before that there is nothing merged. */
export const useRefinedPoints = (scanId: number, page: number, enabled: boolean) => useQuery({ ...getRefinedPointsQueryOptions(scanId, page), enabled });
