import { auditEventSchema, pageOf } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

const auditEventPageSchema = pageOf(auditEventSchema);

export interface GetAuditEventsParams {
  page?: number;
  pageSize?: number;
  action?: string;
}

export const getAuditEvents = ({ page = 1, pageSize = 20, action }: GetAuditEventsParams, signal?: AbortSignal) =>
  api.get('/admin/audit-events', { query: { page, pageSize, action: action || undefined }, schema: auditEventPageSchema, signal });

export const getAuditEventsQueryOptions = ({ page = 1, pageSize = 20, action = '' }: GetAuditEventsParams = {}) =>
  queryOptions({
    queryKey: ['admin', 'audit-events', { page, pageSize, action }],
    queryFn: ({ signal }) => getAuditEvents({ page, pageSize, action }, signal),
    placeholderData: keepPreviousData,
  });

export const useAuditEvents = (params: GetAuditEventsParams = {}) => useQuery(getAuditEventsQueryOptions(params));
