import { auditEventSchema, pageOf } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AuditFilters } from '../utils/audit-filters';

const auditEventPageSchema = pageOf(auditEventSchema);

export interface GetAuditEventsParams extends AuditFilters {
  page?: number;
  pageSize?: number;
}

export const getAuditEvents = ({ page = 1, pageSize = 20, ...filters }: GetAuditEventsParams, signal?: AbortSignal) =>
  api.get('/admin/audit-events', { query: { page, pageSize, ...filters }, schema: auditEventPageSchema, signal });

export const getAuditEventsQueryOptions = ({ page = 1, pageSize = 20, ...filters }: GetAuditEventsParams = {}) =>
  queryOptions({
    queryKey: ['admin', 'audit-events', { page, pageSize, ...filters }],
    queryFn: ({ signal }) => getAuditEvents({ page, pageSize, ...filters }, signal),
    placeholderData: keepPreviousData,
  });

export const useAuditEvents = (params: GetAuditEventsParams = {}) => useQuery(getAuditEventsQueryOptions(params));
