import { refinedPointPageSchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PointsQuery } from '@/lib/points-query';

export const REFINED_POINTS_PAGE_SIZE = 50;

/** A page of the merged table under a points query (sort, filters, likelihood, page), as a scan's `/points` takes it. */
export const getRefinedPoints = (scanId: number, query: PointsQuery, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/refinement/points`, { schema: refinedPointPageSchema, query: { ...query, pageSize: String(REFINED_POINTS_PAGE_SIZE) }, signal });

export const getRefinedPointsQueryOptions = (scanId: number, query: PointsQuery) =>
  queryOptions({
    queryKey: ['scans', 'refined-points', scanId, query],
    queryFn: ({ signal }) => getRefinedPoints(scanId, query, signal),
    placeholderData: keepPreviousData,
  });

/** Asked only once a level has completed (`enabled`): before that there is nothing merged. */
export const useRefinedPoints = (scanId: number, query: PointsQuery, enabled: boolean) => useQuery({ ...getRefinedPointsQueryOptions(scanId, query), enabled });
