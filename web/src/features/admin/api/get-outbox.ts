import { outboxMessageSummarySchema, pageOf } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

const outboxPageSchema = pageOf(outboxMessageSummarySchema);

export interface GetOutboxParams {
  page?: number;
  pageSize?: number;
  to?: string;
}

/** Messages the local mail catcher received (development and tests only). */
export const getOutbox = ({ page = 1, pageSize = 50, to }: GetOutboxParams, signal?: AbortSignal) =>
  api.get('/admin/outbox', { query: { page, pageSize, to: to || undefined }, schema: outboxPageSchema, signal });

export const getOutboxQueryOptions = ({ page = 1, pageSize = 50, to = '' }: GetOutboxParams = {}) =>
  queryOptions({
    queryKey: ['admin', 'outbox', { page, pageSize, to }],
    queryFn: ({ signal }) => getOutbox({ page, pageSize, to }, signal),
    placeholderData: keepPreviousData,
  });

export const useOutbox = (params: GetOutboxParams = {}) => useQuery(getOutboxQueryOptions(params));
