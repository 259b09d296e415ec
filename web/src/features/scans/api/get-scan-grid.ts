import { GRID_MAX_CELLS, scanGridSliceSchema, type PointOutput, type ScanGridSlice } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SliceWindow } from '../utils/grid-cells';
import { LIVE_REFRESH_MS } from './get-scan';
import { scanResultsKey } from './scan-results-key';

/** Cells per axis of a heatmap panel beside others; a full-width panel asks for the API's most. */
export const PANEL_CELLS = 200;
/**
 * Cells per axis of a panel beside others while the scan is live: a quarter of the cells to parse
 * and draw at each refresh, so the page stays responsive as the maps fill in.
 */
export const LIVE_PANEL_CELLS = 100;

/** The cells per axis a panel asks for. */
export const panelCells = ({ wide, live }: { wide: boolean; live: boolean }) =>
  live ? (wide ? PANEL_CELLS : LIVE_PANEL_CELLS) : wide ? GRID_MAX_CELLS : PANEL_CELLS;

/**
 * A live slice is asked again LIVE_REFRESH_MS after its last answer, or LIVE_SLICE_BACKOFF times as
 * long as that answer took if longer: a slice that keeps the server busy for a second (a 10^6-point
 * scan) is asked every 10 s, so a watched scan leaves its workers the CPU. The time counts from the
 * answer, so requests for one panel never overlap.
 */
export const LIVE_SLICE_BACKOFF = 10;
export const liveSliceRefreshMs = (lastAnswerMs: number | undefined) => Math.max(LIVE_REFRESH_MS, LIVE_SLICE_BACKOFF * (lastAnswerMs ?? 0));

export interface ScanGridParams {
  x: string;
  y: string;
  output: PointOutput | 'status' | 'deltaChi2';
  /** The set `deltaChi2` is judged by, as `key@version`. */
  likelihood?: string;
  /** Index along each axis that is neither x nor y. */
  at: Record<string, number>;
  /** Most cells along each axis (the API's limit when absent). */
  maxCells?: number;
  /** A zoom window in axis indices; the whole slice when absent. */
  window?: SliceWindow | null;
}

export const getScanGrid = (scanId: number, { x, y, output, likelihood, at, maxCells, window }: ScanGridParams, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/grid`, {
    schema: scanGridSliceSchema,
    query: {
      x, y, output,
      ...(likelihood !== undefined && { likelihood }),
      ...Object.fromEntries(Object.entries(at).map(([name, index]) => [`at.${name}`, index])),
      ...(maxCells !== undefined && { maxCells }),
      ...window,
    },
    signal,
  });

/** How long each answer took from asking to parsed, kept beside the answer itself. */
const answerMs = new WeakMap<ScanGridSlice, number>();

/** `live` refetches as liveSliceRefreshMs says, so a heatmap fills in while workers store points. */
export const getScanGridQueryOptions = (scanId: number, params: ScanGridParams, { live = false, enabled = true }: { live?: boolean; enabled?: boolean } = {}) =>
  queryOptions({
    enabled,
    queryKey: [...scanResultsKey(scanId), 'grid', params],
    queryFn: async ({ signal }) => {
      const started = performance.now();
      const slice = await getScanGrid(scanId, params, signal);
      answerMs.set(slice, performance.now() - started);
      return slice;
    },
    // Moving a slider shows the previous slice until the next one arrives, instead of a spinner.
    placeholderData: keepPreviousData,
    refetchInterval: (query) => (live ? liveSliceRefreshMs(query.state.data && answerMs.get(query.state.data)) : false),
  });

export const useScanGridSlice = (scanId: number, params: ScanGridParams, options: { live?: boolean; enabled?: boolean } = {}) =>
  useQuery(getScanGridQueryOptions(scanId, params, options));
