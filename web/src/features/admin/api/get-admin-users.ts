import { adminUserSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const adminUserListSchema = z.array(adminUserSchema);

export const getAdminUsers = (signal?: AbortSignal) => api.get('/admin/users', { schema: adminUserListSchema, signal });

export const getAdminUsersQueryOptions = () =>
  queryOptions({
    queryKey: ['admin', 'users'],
    queryFn: ({ signal }) => getAdminUsers(signal),
  });

export const useAdminUsers = () => useQuery(getAdminUsersQueryOptions());
