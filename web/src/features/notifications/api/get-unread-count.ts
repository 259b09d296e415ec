import { unreadCountSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** How often the header asks for news while the app is open. */
export const UNREAD_REFRESH_MS = 30_000;

export const getUnreadCount = (signal?: AbortSignal) => api.get('/notifications/unread-count', { schema: unreadCountSchema, signal });

export const getUnreadCountQueryOptions = () =>
  queryOptions({
    queryKey: ['notifications', 'unread-count'],
    queryFn: ({ signal }) => getUnreadCount(signal),
    refetchInterval: UNREAD_REFRESH_MS,
  });

/** Only asks while someone is signed in; a signed-out page has nobody to count for. */
export const useUnreadCount = ({ enabled }: { enabled: boolean }) => useQuery({ ...getUnreadCountQueryOptions(), enabled });
