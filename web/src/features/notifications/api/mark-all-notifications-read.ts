import { unreadCountSchema, type UnreadCount } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getUnreadCountQueryOptions } from './get-unread-count';

export const markAllNotificationsRead = (): Promise<UnreadCount> => api.post('/notifications/read-all', { schema: unreadCountSchema });

export function useMarkAllNotificationsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markAllNotificationsRead,
    onSuccess: async (count) => {
      queryClient.setQueryData(getUnreadCountQueryOptions().queryKey, count);
      await queryClient.invalidateQueries({ queryKey: ['notifications', 'list'] });
    },
  });
}
