import { scanGridSliceSchema, type PointOutput } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { LIVE_REFRESH_MS } from './get-scan';
import { scanResultsKey } from './scan-results-key';

export interface ScanGridParams {
  x: string;
  y: string;
  output: PointOutput | 'status';
  /** Index along each axis that is neither x nor y. */
  at: Record<string, number>;
}

export const getScanGrid = (scanId: number, { x, y, output, at }: ScanGridParams, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/grid`, {
    schema: scanGridSliceSchema,
    query: { x, y, output, ...Object.fromEntries(Object.entries(at).map(([name, index]) => [`at.${name}`, index])) },
    signal,
  });

/** `live` refetches every LIVE_REFRESH_MS, so a heatmap fills in while workers store points. */
export const getScanGridQueryOptions = (scanId: number, params: ScanGridParams, { live = false }: { live?: boolean } = {}) =>
  queryOptions({
    queryKey: [...scanResultsKey(scanId), 'grid', params],
    queryFn: ({ signal }) => getScanGrid(scanId, params, signal),
    // Moving a slider shows the previous slice until the next one arrives, instead of a spinner.
    placeholderData: keepPreviousData,
    refetchInterval: live ? LIVE_REFRESH_MS : false,
  });

export const useScanGridSlice = (scanId: number, params: ScanGridParams, options: { live?: boolean } = {}) =>
  useQuery(getScanGridQueryOptions(scanId, params, options));
