import { notificationSchema, type NotificationDto } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const markNotificationRead = (notificationId: number): Promise<NotificationDto> =>
  api.post(`/notifications/${notificationId}/read`, { schema: notificationSchema });

export function useMarkNotificationRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markNotificationRead,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['notifications'] }),
  });
}
