import { scanPointPageSchema, type PointExportFormat } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';
import type { PointsQuery } from '@/lib/points-query';
import { LIVE_REFRESH_MS } from './get-scan';

export const getScanPoints = (scanId: number, query: PointsQuery, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/points`, { query, schema: scanPointPageSchema, signal });

export const getScanPointsQueryOptions = (scanId: number, query: PointsQuery, live: boolean) =>
  queryOptions({
    queryKey: ['scans', 'points', scanId, query],
    queryFn: ({ signal }) => getScanPoints(scanId, query, signal),
    placeholderData: keepPreviousData,
    refetchInterval: live ? LIVE_REFRESH_MS : false,
  });

export const useScanPoints = (scanId: number, query: PointsQuery, live: boolean) =>
  useQuery(getScanPointsQueryOptions(scanId, query, live));

/** The download address of every point matching the filters (sorting kept, paging dropped). */
export function pointsExportHref(scanId: number, query: PointsQuery, format: PointExportFormat): string {
  const search = new URLSearchParams({ ...query, format });
  search.delete('page');
  search.delete('pageSize');
  return `${env.VITE_API_BASE_PATH}/scans/${scanId}/points?${search.toString()}`;
}
