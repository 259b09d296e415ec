import { currentUserSchema, type CurrentUser } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiRequestError } from '@/lib/api-client';
import { meQueryKey } from '@/lib/query-client';

/** The signed-in user, or null when there is no session (a 401 is an answer here, not an error). */
export async function getMe(signal?: AbortSignal): Promise<CurrentUser | null> {
  try {
    return await api.get('/auth/me', { schema: currentUserSchema, signal });
  } catch (error) {
    if (error instanceof ApiRequestError && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: meQueryKey,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

export const useMe = () => useQuery(getMeQueryOptions());
