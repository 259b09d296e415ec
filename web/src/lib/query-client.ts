import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from './api-client';

/** Key of the signed-in user; the auth feature's queryOptions use it too. */
export const meQueryKey = ['auth', 'me'] as const;
/** Key of the sign-out mutation, so a 401 it causes itself is not taken for an expired session. */
export const logoutMutationKey = ['auth', 'logout'] as const;

const isClientError = (error: unknown) =>
  error instanceof ApiRequestError && error.status >= 400 && error.status < 500;

/**
 * One place for session expiry: any 401 forgets the cached user. The protected route watches
 * that user, so it sends the browser to sign-in with `next` set to where it was. While signing
 * out, a poll that lands after the session ended is ignored: the sign-out itself leaves the page.
 */
export function createQueryClient(): QueryClient {
  const onError = (error: unknown) => {
    if (!(error instanceof ApiRequestError) || error.status !== 401) return;
    if (queryClient.isMutating({ mutationKey: logoutMutationKey }) > 0) return;
    queryClient.setQueryData(meQueryKey, null);
  };
  // onError runs only after construction, when queryClient is set.
  const queryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // Retrying a 4xx only repeats the same answer; network and 5xx errors get two more tries.
        retry: (failureCount, error) => !isClientError(error) && failureCount < 2,
      },
      mutations: { retry: false },
    },
  });
  return queryClient;
}
