import type { ScanDetail } from '@sixtyfold/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef } from 'react';
import { isLive } from '../api/get-scan';
import { getScanPointsQueryOptions } from '../api/get-scan-points';
import { scanResultsKey } from '../api/scan-results-key';

/** Reads a scan's results (heatmaps, plane, constraints, points table) again, e.g. when a refinement level adds to them. */
export function useScanResultsRefresher(scanId: number | undefined): () => void {
  const queryClient = useQueryClient();
  return useCallback(() => {
    if (scanId === undefined) return;
    void queryClient.invalidateQueries({ queryKey: scanResultsKey(scanId) });
    void queryClient.invalidateQueries({ queryKey: getScanPointsQueryOptions(scanId, {}, false).queryKey.slice(0, 3) });
  }, [scanId, queryClient]);
}

/**
 * Live views (heatmaps, plane, points table) poll every few seconds, so the last points of a scan can land between a poll and
 * the moment the scan finishes. When it stops being live, read its results once more.
 */
export function useRefreshWhenFinished(scan: Pick<ScanDetail, 'id' | 'status'> | undefined) {
  const refresh = useScanResultsRefresher(scan?.id);
  const wasLive = useRef(false);
  const live = isLive(scan);
  useEffect(() => {
    if (wasLive.current && !live) refresh();
    wasLive.current = live;
  }, [live, refresh]);
}
