import type { ScanPointDto } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { LIVE_REFRESH_MS } from './get-scan';
import { getScanPoints } from './get-scan-points';
import { scanResultsKey } from './scan-results-key';

// The most the points API gives in one page.
const PAGE_SIZE = 1000;
/** A line of 10,000 points is more than a plot can show apart; longer axes are cut, and say so. */
export const LINE_POINT_LIMIT = 10_000;

export interface ScanLine {
  /** Stored points in grid order, failed ones included. */
  points: ScanPointDto[];
  /** Stored points in all; more than `points.length` when the line was cut. */
  stored: number;
}

/** The stored points of a one-axis scan in grid order, page by page. */
export async function getScanLine(scanId: number, signal?: AbortSignal): Promise<ScanLine> {
  const points: ScanPointDto[] = [];
  for (let page = 1; ; page++) {
    const result = await getScanPoints(scanId, { page: String(page), pageSize: String(PAGE_SIZE), sort: 'pointIndex', order: 'asc' }, signal);
    points.push(...result.items);
    if (points.length >= result.total || result.items.length === 0 || points.length >= LINE_POINT_LIMIT) {
      return { points: points.slice(0, LINE_POINT_LIMIT), stored: result.total };
    }
  }
}

export const getScanLineQueryOptions = (scanId: number, { live = false }: { live?: boolean } = {}) =>
  queryOptions({
    queryKey: [...scanResultsKey(scanId), 'line'],
    queryFn: ({ signal }) => getScanLine(scanId, signal),
    placeholderData: keepPreviousData,
    refetchInterval: live ? LIVE_REFRESH_MS : false,
  });

export const useScanLine = (scanId: number, options: { live?: boolean } = {}) => useQuery(getScanLineQueryOptions(scanId, options));
