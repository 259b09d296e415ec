import { Heading, Stack } from '@chakra-ui/react';
import { useNavigate, useParams } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useGroup } from '@/features/groups/api/get-group';
import { GroupDetail } from '@/features/groups/components/group-detail';
import { GroupSettingsForm } from '@/features/groups/components/group-settings-form';
import { InviteForm } from '@/features/groups/components/invite-form';
import { PendingInvitations } from '@/features/groups/components/pending-invitations';
import { RetentionSettings } from '@/features/maintenance/components/retention-settings';
import { GroupConstraintRegions } from '@/features/constraint-regions/components/group-constraint-regions';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { ApiRequestError } from '@/lib/api-client';
import { NotFoundRoute } from './not-found';

export function GroupRoute() {
  const groupId = Number(useParams().groupId);
  if (!Number.isInteger(groupId) || groupId <= 0) return <NotFoundRoute />;
  return <GroupPage groupId={groupId} />;
}

function GroupPage({ groupId }: { groupId: number }) {
  const group = useGroup(groupId);
  const { data: me } = useMe();
  const navigate = useNavigate();
  useDocumentTitle(group.data?.name ?? 'Group');

  if (group.isPending) return <LoadingState label="Loading group…" />;
  if (group.isError) {
    const notFound = group.error instanceof ApiRequestError && group.error.status === 404;
    return (
      <Stack>
        <PageHeader title="Group" />
        <ErrorState
          title={notFound ? 'This group does not exist, or you are not one of its members' : 'Could not load this group'}
          error={group.error}
          onRetry={notFound ? undefined : () => group.refetch()}
        />
      </Stack>
    );
  }
  // Site admins act as leads in every group; the API checks again.
  const canManage = group.data.myRole === 'lead' || me?.siteRole === 'admin';
  return (
    <Stack gap="0">
      <PageHeader title={group.data.name} description={group.data.description || undefined} />
      <Stack gap="6">
        <GroupDetail
          group={group.data}
          canManage={canManage}
          myUserId={me?.id ?? 0}
          onLeft={() => navigate(paths.home.getHref(), { replace: true })}
        />
        {canManage && (
          <>
            <Panel>
              <Heading as="h2" size="sm" px="4" pt="4" pb="3" color="ink.900">
                Invite someone
              </Heading>
              <Stack px="4" pb="4">
                <InviteForm groupId={groupId} />
              </Stack>
            </Panel>
            <Panel>
              <Heading as="h2" size="sm" px="4" pt="4" pb="3" color="ink.900">
                Pending invitations
              </Heading>
              <PendingInvitations groupId={groupId} />
            </Panel>
          </>
        )}
        <Panel>
          <Heading as="h2" size="sm" px="4" pt="4" pb="3" color="ink.900">
            Constraint regions
          </Heading>
          <GroupConstraintRegions groupId={groupId} groupName={group.data.name} user={me} />
        </Panel>
        <Panel>
          <Heading as="h2" size="sm" px="4" pt="4" pb="3" color="ink.900">
            Retention
          </Heading>
          <Stack px="4" pb="4">
            <RetentionSettings groupId={groupId} canChange={canManage} />
          </Stack>
        </Panel>
        {me?.siteRole === 'admin' && (
          <Panel>
            <Heading as="h2" size="sm" px="4" pt="4" pb="3" color="ink.900">
              Group settings
            </Heading>
            <Stack px="4" pb="4">
              <GroupSettingsForm key={group.data.id} group={group.data} />
            </Stack>
          </Panel>
        )}
      </Stack>
    </Stack>
  );
}
