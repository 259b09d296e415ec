import { scanPlaneSchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { LIVE_REFRESH_MS } from './get-scan';
import { scanResultsKey } from './scan-results-key';

/** More points than this are sampled by the API (it says by which steps): a plot shows no more apart. */
export const PLANE_POINT_LIMIT = 5_000;

export const getScanPlane = (scanId: number, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/plane`, { query: { limit: PLANE_POINT_LIMIT }, schema: scanPlaneSchema, signal });

export const getScanPlaneQueryOptions = (scanId: number, { live = false }: { live?: boolean } = {}) =>
  queryOptions({
    queryKey: [...scanResultsKey(scanId), 'plane'],
    queryFn: ({ signal }) => getScanPlane(scanId, signal),
    placeholderData: keepPreviousData,
    refetchInterval: live ? LIVE_REFRESH_MS : false,
  });

export const useScanPlane = (scanId: number, options: { live?: boolean } = {}) => useQuery(getScanPlaneQueryOptions(scanId, options));
