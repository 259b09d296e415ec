import { invitationListSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Pending invitations of a group (leads and site admins). */
export const getInvitations = (groupId: number, signal?: AbortSignal) =>
  api.get(`/groups/${groupId}/invitations`, { schema: invitationListSchema, signal });

export const getInvitationsQueryOptions = (groupId: number) =>
  queryOptions({
    queryKey: ['groups', 'invitations', groupId],
    queryFn: ({ signal }) => getInvitations(groupId, signal),
  });

export const useInvitations = (groupId: number, { enabled = true }: { enabled?: boolean } = {}) =>
  useQuery({ ...getInvitationsQueryOptions(groupId), enabled });
