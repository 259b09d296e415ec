import { ApiRequestError } from './api-client';
import { createQueryClient, logoutMutationKey, meQueryKey } from './query-client';

const user = { id: 1, email: 'lucia.marin@halvorsen.example' };
const refused = () => Promise.reject(new ApiRequestError(401, 'You are not signed in.'));

describe('createQueryClient', () => {
  it('forgets the signed-in user on any 401, so the protected route sends the browser to sign-in', async () => {
    const client = createQueryClient();
    client.setQueryData(meQueryKey, user);
    await client.fetchQuery({ queryKey: ['scans'], queryFn: refused }).catch(() => undefined);
    expect(client.getQueryData(meQueryKey)).toBeNull();
  });

  it('keeps the user while signing out: a poll refused after the session ended is not an expiry', async () => {
    const client = createQueryClient();
    client.setQueryData(meQueryKey, user);
    let finishLogout!: () => void;
    const logout = client
      .getMutationCache()
      .build(client, { mutationKey: logoutMutationKey, mutationFn: () => new Promise<void>((resolve) => (finishLogout = resolve)) })
      .execute(undefined);
    await client.fetchQuery({ queryKey: ['notifications', 'unread'], queryFn: refused }).catch(() => undefined);
    expect(client.getQueryData(meQueryKey)).toEqual(user);
    finishLogout();
    await logout;
    await client.fetchQuery({ queryKey: ['outbox'], queryFn: refused }).catch(() => undefined);
    expect(client.getQueryData(meQueryKey)).toBeNull();
  });
});
