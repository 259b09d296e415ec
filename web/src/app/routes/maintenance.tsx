import { Box, Heading, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { DateTime } from '@/components/ui/date-time';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { useAdminUsers } from '@/features/admin/api/get-admin-users';
import { RequireSiteAdmin } from '@/features/auth/components/require-site-admin';
import { useArchives } from '@/features/maintenance/api/get-archives';
import { useStorage } from '@/features/maintenance/api/get-storage';
import { ArchivesTable } from '@/features/maintenance/components/archives-table';
import { PruneForm } from '@/features/maintenance/components/prune-form';
import { GroupStorageTable, ScanStorageTable } from '@/features/maintenance/components/storage-tables';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { formatBytes } from '@/lib/format-bytes';

export function MaintenanceRoute() {
  useDocumentTitle('Maintenance');
  return (
    <RequireSiteAdmin>
      <MaintenancePage />
    </RequireSiteAdmin>
  );
}

function Section({ id, title, description, children }: { id: string; title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <Box as="section" aria-labelledby={id}>
      <Stack gap="1" mb="3">
        <Heading as="h2" id={id} size="lg" color="ink.900">
          {title}
        </Heading>
        {description && (
          <Text color="fg.muted" fontSize="sm">
            {description}
          </Text>
        )}
      </Stack>
      {children}
    </Box>
  );
}

function MaintenancePage() {
  const storage = useStorage();
  const archives = useArchives();
  const users = useAdminUsers();
  const groupNames = new Map((storage.data?.groups ?? []).map((g) => [g.groupId, g.groupName]));

  return (
    <Stack gap="0">
      <PageHeader
        title="Maintenance"
        description="How much the stored scans take, pruning old ones (each is archived first), and the archives of deleted scans."
      />
      <Stack gap="10">
        <Section
          id="maintenance-storage"
          title="Storage"
          description={
            storage.data ? (
              <>
                Figures are MariaDB's own; InnoDB reports sizes per table, so a group's or scan's size is its share: its points times{' '}
                {formatBytes(storage.data.bytesPerPoint)} per point. Retention policies next run{' '}
                {storage.data.retention.nextRunAt ? <DateTime iso={storage.data.retention.nextRunAt} /> : 'never (no job scheduled)'}.
              </>
            ) : undefined
          }
        >
          {storage.isPending ? (
            <LoadingState label="Loading storage figures…" />
          ) : storage.isError ? (
            <ErrorState title="Could not load storage figures" error={storage.error} onRetry={() => storage.refetch()} />
          ) : storage.data.groups.length === 0 ? (
            <EmptyState title="No groups" description="Groups and their scans appear here once they exist." />
          ) : (
            <Stack gap="4">
              <Panel>
                <GroupStorageTable groups={storage.data.groups} />
              </Panel>
              <Panel>
                <ScanStorageTable scans={storage.data.scans} groupNames={groupNames} />
              </Panel>
            </Stack>
          )}
        </Section>

        <Section id="maintenance-prune" title="Prune scans" description="List what a filter selects, check it, then delete exactly those scans.">
          <Panel p={{ base: '4', md: '6' }}>
            <PruneForm
              groups={(storage.data?.groups ?? []).map((g) => ({ id: g.groupId, name: g.groupName }))}
              owners={(users.data ?? []).map((u) => ({ id: u.id, name: u.displayName }))}
            />
          </Panel>
        </Section>

        <Section id="maintenance-archives" title="Archives" description="A .tar.gz per deleted scan: scan.json (its record and specification) and points.csv.">
          {archives.isPending ? (
            <LoadingState label="Loading archives…" />
          ) : archives.isError ? (
            <ErrorState title="Could not load archives" error={archives.error} onRetry={() => archives.refetch()} />
          ) : archives.data.length === 0 ? (
            <EmptyState title="No archives yet" description="Every deleted scan is archived here first." />
          ) : (
            <Panel>
              <ArchivesTable archives={archives.data} groupNames={groupNames} />
            </Panel>
          )}
        </Section>
      </Stack>
    </Stack>
  );
}
