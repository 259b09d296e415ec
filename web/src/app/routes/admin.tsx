import { Box, Heading, Stack, Text } from '@chakra-ui/react';
import type { AdminUser } from '@sixtyfold/shared';
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { FailureAlert } from '@/components/ui/failure-alert';
import { ErrorState } from '@/components/ui/error-state';
import { UsersIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Pager } from '@/components/ui/pager';
import { Panel } from '@/components/ui/panel';
import { useAdminUsers } from '@/features/admin/api/get-admin-users';
import { useAuditEvents } from '@/features/admin/api/get-audit-events';
import { useSetUserDisabled } from '@/features/admin/api/set-user-disabled';
import { AuditEventsTable } from '@/features/admin/components/audit-events-table';
import { AuditFiltersForm } from '@/features/admin/components/audit-filters-form';
import { DisableUserDialog } from '@/features/admin/components/disable-user-dialog';
import { UsersTable } from '@/features/admin/components/users-table';
import { auditFilterChanges, hasAuditFilters, readAuditFilters } from '@/features/admin/utils/audit-filters';
import { useMe } from '@/features/auth/api/get-me';
import { RequireSiteAdmin } from '@/features/auth/components/require-site-admin';
import { useGroups } from '@/features/groups/api/get-groups';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { readPage } from '@/lib/search-params';

const AUDIT_PAGE_SIZE = 20;

export function AdminRoute() {
  useDocumentTitle('Admin');
  return (
    <RequireSiteAdmin>
      <Stack gap="0">
        <PageHeader title="Admin" description="Everyone with a Sixtyfold account, and the audit log of what happened on this site." />
        <Stack gap="10">
          <UsersSection />
          <AuditSection />
        </Stack>
      </Stack>
    </RequireSiteAdmin>
  );
}

function UsersSection() {
  const users = useAdminUsers();
  const me = useMe();
  const [disabling, setDisabling] = useState<AdminUser | null>(null);
  const enable = useSetUserDisabled();
  return (
    <Box as="section" aria-labelledby="admin-users">
      <Stack gap="1" mb="3">
        <Heading as="h2" id="admin-users" size="lg" color="ink.900">
          Users
        </Heading>
        <Text color="fg.muted" fontSize="sm">
          A disabled account is signed out everywhere, cannot sign in and its API tokens stop working, until it is enabled again.
        </Text>
      </Stack>
      {enable.isError && (
        <FailureAlert title="Could not enable the account" mb="4">
          {enable.error.message}
        </FailureAlert>
      )}
      {users.isPending ? (
        <LoadingState label="Loading users…" />
      ) : users.isError ? (
        <ErrorState title="Could not load users" error={users.error} onRetry={() => users.refetch()} />
      ) : users.data.length === 0 ? (
        <EmptyState icon={<UsersIcon />} title="No users" description="Accounts appear here once they are created." />
      ) : (
        <Panel>
          <UsersTable
            users={users.data}
            currentUserId={me.data?.id}
            onDisable={setDisabling}
            onEnable={(user) => enable.mutate({ userId: user.id, disabled: false })}
            enablingId={enable.isPending ? enable.variables.userId : null}
          />
        </Panel>
      )}
      <DisableUserDialog user={disabling} onClose={() => setDisabling(null)} />
    </Box>
  );
}

function AuditSection() {
  const [params, setParams] = useSearchParams();
  const page = readPage(params.get('auditPage'));
  const filters = readAuditFilters(params);
  const filtered = hasAuditFilters(filters);
  const events = useAuditEvents({ page, pageSize: AUDIT_PAGE_SIZE, ...filters });
  // Options for the actor and group selects, e-mails as the table shows actors (the users section reads the same query).
  const users = useAdminUsers();
  const groups = useGroups();
  const actors = (users.data ?? []).map((u) => ({ id: u.id, label: u.email }));
  const groupOptions = (groups.data ?? []).map((g) => ({ id: g.id, label: g.name }));

  const update = (changes: Record<string, string | null>) =>
    setParams((current) => {
      const copy = new URLSearchParams(current);
      for (const [key, value] of Object.entries(changes)) {
        if (value) copy.set(key, value);
        else copy.delete(key);
      }
      return copy;
    });

  return (
    <Box as="section" aria-labelledby="admin-audit">
      <Stack gap="1" mb="3">
        <Heading as="h2" id="admin-audit" size="lg" color="ink.900">
          Audit events
        </Heading>
        <Text color="fg.muted" fontSize="sm">
          Sign-ins, membership changes and other recorded actions.
        </Text>
      </Stack>
      <Panel p="4" mb="4">
        <AuditFiltersForm
          key={JSON.stringify(filters)}
          value={filters}
          onChange={(next) => update({ ...auditFilterChanges(next), auditPage: null })}
          actors={actors}
          groups={groupOptions}
        />
      </Panel>
      {events.isPending ? (
        <LoadingState label="Loading audit events…" />
      ) : events.isError && !events.data ? (
        <ErrorState title="Could not load audit events" error={events.error} onRetry={() => events.refetch()} />
      ) : events.data.total === 0 ? (
        <EmptyState
          title={filtered ? 'No events match these filters' : 'No audit events yet'}
          description={filtered ? 'Nothing recorded matches all of them. Check the action name and the days, or clear the filters.' : 'Recorded actions appear here as people use Sixtyfold.'}
        />
      ) : (
        <>
          {events.isError && (
            <Box mb="4">
              <ErrorState title="Could not refresh audit events" error={events.error} onRetry={() => events.refetch()} />
            </Box>
          )}
          <Panel>
            {events.data.items.length === 0 ? (
              <Text p="4" color="fg.muted">
                No events on page {page}. Go back a page.
              </Text>
            ) : (
              <AuditEventsTable events={events.data.items} />
            )}
          </Panel>
          <Pager
            page={page}
            pageSize={events.data.pageSize || AUDIT_PAGE_SIZE}
            total={events.data.total}
            noun="events"
            onPageChange={(next) => update({ auditPage: next > 1 ? String(next) : null })}
            busy={events.isPlaceholderData}
          />
        </>
      )}
    </Box>
  );
}
