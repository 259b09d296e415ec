import { notificationSchema, pageOf } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

const notificationPageSchema = pageOf(notificationSchema);

export interface GetNotificationsParams {
  page?: number;
  pageSize?: number;
  unreadOnly?: boolean;
}

/** My notifications, newest first (the API's order). */
export const getNotifications = ({ page = 1, pageSize = 20, unreadOnly = false }: GetNotificationsParams, signal?: AbortSignal) =>
  api.get('/notifications', { query: { page, pageSize, unread: unreadOnly ? 'true' : undefined }, schema: notificationPageSchema, signal });

export const getNotificationsQueryOptions = ({ page = 1, pageSize = 20, unreadOnly = false }: GetNotificationsParams = {}) =>
  queryOptions({
    queryKey: ['notifications', 'list', { page, pageSize, unreadOnly }],
    queryFn: ({ signal }) => getNotifications({ page, pageSize, unreadOnly }, signal),
    placeholderData: keepPreviousData,
  });

export const useNotifications = (params: GetNotificationsParams = {}) => useQuery(getNotificationsQueryOptions(params));
