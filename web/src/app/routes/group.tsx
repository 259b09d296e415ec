import { Stack } from '@chakra-ui/react';
import { useParams } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { useGroup } from '@/features/groups/api/get-group';
import { GroupDetail } from '@/features/groups/components/group-detail';
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
  return (
    <Stack gap="0">
      <PageHeader title={group.data.name} description={group.data.description || undefined} />
      <GroupDetail group={group.data} />
    </Stack>
  );
}
