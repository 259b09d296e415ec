import { invitationPreviewSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** What an invitation link offers; 404 and 410 carry the reason the link cannot be used. */
export const getInvitation = (token: string, signal?: AbortSignal) =>
  api.get(`/invitations/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema, signal });

export const getInvitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitations', token],
    queryFn: ({ signal }) => getInvitation(token, signal),
  });

export const useInvitation = (token: string) => useQuery(getInvitationQueryOptions(token));
