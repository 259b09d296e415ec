import type { ScanDetail } from '@sixtyfold/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { isLive } from '../api/get-scan';
import { getScanPointsQueryOptions } from '../api/get-scan-points';
import { scanResultsKey } from '../api/scan-results-key';

/**
 * Live views (heatmaps, plane, points table) poll every few seconds, so the last points of a scan can land between a poll and
 * the moment the scan finishes. When it stops being live, read its results once more.
 */
export function useRefreshWhenFinished(scan: Pick<ScanDetail, 'id' | 'status'> | undefined) {
  const queryClient = useQueryClient();
  const wasLive = useRef(false);
  const live = isLive(scan);
  useEffect(() => {
    if (wasLive.current && !live && scan) {
      void queryClient.invalidateQueries({ queryKey: scanResultsKey(scan.id) });
      void queryClient.invalidateQueries({ queryKey: getScanPointsQueryOptions(scan.id, {}, false).queryKey.slice(0, 3) });
    }
    wasLive.current = live;
  }, [live, scan, queryClient]);
}
