import { scanGridSliceSchema, type PointOutput } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SliceWindow } from '../utils/grid-cells';
import { LIVE_REFRESH_MS } from './get-scan';
import { scanResultsKey } from './scan-results-key';

/** Cells per axis of a heatmap panel beside others; a full-width panel asks for the API's most. */
export const PANEL_CELLS = 200;

export interface ScanGridParams {
  x: string;
  y: string;
  output: PointOutput | 'status';
  /** Index along each axis that is neither x nor y. */
  at: Record<string, number>;
  /** Most cells along each axis (the API's limit when absent). */
  maxCells?: number;
  /** A zoom window in axis indices; the whole slice when absent. */
  window?: SliceWindow | null;
}

export const getScanGrid = (scanId: number, { x, y, output, at, maxCells, window }: ScanGridParams, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/grid`, {
    schema: scanGridSliceSchema,
    query: {
      x, y, output,
      ...Object.fromEntries(Object.entries(at).map(([name, index]) => [`at.${name}`, index])),
      ...(maxCells !== undefined && { maxCells }),
      ...window,
    },
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
