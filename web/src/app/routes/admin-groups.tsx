import { Box, Heading, Stack, Table } from '@chakra-ui/react';
import { useNavigate } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { RequireSiteAdmin } from '@/features/auth/components/require-site-admin';
import { useGroups } from '@/features/groups/api/get-groups';
import { CreateGroupForm } from '@/features/groups/components/create-group-form';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function AdminGroupsRoute() {
  useDocumentTitle('Groups');
  const navigate = useNavigate();
  return (
    <RequireSiteAdmin>
      <Stack gap="0">
        <PageHeader title="Groups" description="Every research group on this site. Open one to manage its members and invitations." />
        <Stack gap="10">
          <GroupList />
          <Box as="section" aria-labelledby="admin-new-group">
            <Heading as="h2" id="admin-new-group" size="lg" color="ink.900" mb="3">
              New group
            </Heading>
            <Panel p="4">
              <CreateGroupForm onCreated={(group) => navigate(paths.group.getHref(group.id))} />
            </Panel>
          </Box>
        </Stack>
      </Stack>
    </RequireSiteAdmin>
  );
}

function GroupList() {
  const groups = useGroups();
  if (groups.isPending) return <LoadingState label="Loading groups…" />;
  if (groups.isError) return <ErrorState title="Could not load the groups" error={groups.error} onRetry={() => groups.refetch()} />;
  if (groups.data.length === 0) return <EmptyState title="No groups yet" description="Create the first group below, then invite its lead." />;
  return (
    <Panel>
      <Table.ScrollArea>
        <Table.Root size="sm" interactive aria-label="Groups">
          <Table.Header>
            <Table.Row bg="bg.subtle">
              <Table.ColumnHeader>Name</Table.ColumnHeader>
              <Table.ColumnHeader>Description</Table.ColumnHeader>
              <Table.ColumnHeader textAlign="end">Members</Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {groups.data.map((group) => (
              <Table.Row key={group.id}>
                <Table.Cell fontWeight="500">
                  <AppLink to={paths.group.getHref(group.id)} color="ink.900">
                    {group.name}
                  </AppLink>
                </Table.Cell>
                <Table.Cell color="fg.muted">{group.description || '—'}</Table.Cell>
                <Table.Cell textAlign="end" fontFamily="mono">
                  {group.memberCount}
                </Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
    </Panel>
  );
}
