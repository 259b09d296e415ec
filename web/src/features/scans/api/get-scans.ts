import { pageOf, scanSummarySchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

const scanPageSchema = pageOf(scanSummarySchema);

export interface GetScansParams {
  page?: number;
  pageSize?: number;
}

export const getScans = ({ page = 1, pageSize = 25 }: GetScansParams, signal?: AbortSignal) =>
  api.get('/scans', { query: { page, pageSize }, schema: scanPageSchema, signal });

export const getScansQueryOptions = ({ page = 1, pageSize = 25 }: GetScansParams = {}) =>
  queryOptions({
    queryKey: ['scans', 'list', { page, pageSize }],
    queryFn: ({ signal }) => getScans({ page, pageSize }, signal),
    placeholderData: keepPreviousData,
    // While something is computing, poll so progress moves without a reload.
    refetchInterval: (query) =>
      query.state.data?.items.some((scan) => scan.status === 'queued' || scan.status === 'running') ? 5_000 : false,
  });

export const useScans = (params: GetScansParams = {}) => useQuery(getScansQueryOptions(params));
