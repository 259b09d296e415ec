import { pageOf, scanSummarySchema, type ScanStatus } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

const scanPageSchema = pageOf(scanSummarySchema);

export interface GetScansParams {
  page?: number;
  pageSize?: number;
  /** Only scans in this state (the API's `status` filter). */
  status?: ScanStatus;
}

export interface ScansRefresh {
  /** Poll at this interval whatever the list holds; pages that watch live work set it. */
  refetchMs?: number;
}

export const getScans = ({ page = 1, pageSize = 25, status }: GetScansParams, signal?: AbortSignal) =>
  api.get('/scans', { query: { page, pageSize, status }, schema: scanPageSchema, signal });

export const getScansQueryOptions = ({ page = 1, pageSize = 25, status }: GetScansParams = {}, { refetchMs }: ScansRefresh = {}) =>
  queryOptions({
    queryKey: ['scans', 'list', { page, pageSize, status }],
    queryFn: ({ signal }) => getScans({ page, pageSize, status }, signal),
    placeholderData: keepPreviousData,
    // While something is computing, poll so progress moves without a reload.
    refetchInterval: (query) =>
      refetchMs ?? (query.state.data?.items.some((scan) => scan.status === 'queued' || scan.status === 'running') ? 5_000 : false),
  });

export const useScans = (params: GetScansParams = {}, refresh: ScansRefresh = {}) => useQuery(getScansQueryOptions(params, refresh));
