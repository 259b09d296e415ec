import { adminUserSchema, type AdminUser } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getAdminUsersQueryOptions } from './get-admin-users';

export interface SetUserDisabled {
  userId: number;
  disabled: boolean;
}

/** Disables an account (its sessions end, its tokens stop) or re-enables it. */
export const setUserDisabled = ({ userId, disabled }: SetUserDisabled): Promise<AdminUser> =>
  api.post(`/admin/users/${userId}/${disabled ? 'disable' : 'enable'}`, { schema: adminUserSchema });

export function useSetUserDisabled({ onSuccess }: { onSuccess?: (user: AdminUser) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setUserDisabled,
    onSuccess: async (user) => {
      onSuccess?.(user);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: getAdminUsersQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: ['admin', 'audit-events'] }),
      ]);
    },
  });
}
