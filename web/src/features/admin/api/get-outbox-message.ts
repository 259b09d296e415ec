import { outboxMessageSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getOutboxMessage = (messageId: string, signal?: AbortSignal) =>
  api.get(`/admin/outbox/${encodeURIComponent(messageId)}`, { schema: outboxMessageSchema, signal });

export const getOutboxMessageQueryOptions = (messageId: string) =>
  queryOptions({
    queryKey: ['admin', 'outbox', 'message', messageId],
    queryFn: ({ signal }) => getOutboxMessage(messageId, signal),
  });

export const useOutboxMessage = (messageId: string) => useQuery(getOutboxMessageQueryOptions(messageId));
