import type { ChangePassword } from '@sixtyfold/shared';
import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Changes my password; the API ends my other sessions and keeps this one. */
export const changePassword = (data: ChangePassword): Promise<undefined> => api.post('/auth/password', { body: data });

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
