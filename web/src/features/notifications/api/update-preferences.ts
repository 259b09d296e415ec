import { userPreferencesSchema, type UserPreferences } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getPreferencesQueryOptions } from './get-preferences';

export const updatePreferences = (data: UserPreferences): Promise<UserPreferences> =>
  api.patch('/auth/me/preferences', { body: data, schema: userPreferencesSchema });

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    onSuccess: (saved) => queryClient.setQueryData(getPreferencesQueryOptions().queryKey, saved),
  });
}
