import { Box, Button, Stack } from '@chakra-ui/react';
import { Link as RouterLink, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ScanGridIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Pager } from '@/components/ui/pager';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useScans } from '@/features/scans/api/get-scans';
import { ScansTable } from '@/features/scans/components/scans-table';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';
import { readPage } from '@/lib/search-params';

const PAGE_SIZE = 25;

export function ScansRoute() {
  useDocumentTitle('Scans');
  const [params, setParams] = useSearchParams();
  const page = readPage(params.get('page'));
  const { data: user } = useMe();
  const scans = useScans({ page, pageSize: PAGE_SIZE });
  const groupNames = groupNamesOf(user);
  // Members and leads submit scans (site admins act as leads everywhere).
  const canSubmit = user?.siteRole === 'admin' || (user?.memberships ?? []).some((m) => m.role !== 'viewer');

  const goTo = (next: number) =>
    setParams((current) => {
      const copy = new URLSearchParams(current);
      if (next <= 1) copy.delete('page');
      else copy.set('page', String(next));
      return copy;
    });

  return (
    <Stack gap="0">
      <PageHeader
        title="Scans"
        description="Parameter scans run by the groups you belong to, with their status and how far each grid has got."
        actions={
          canSubmit && (
            <Button asChild colorPalette="ember" size="sm">
              <RouterLink to={paths.scanNew.getHref()}>New scan</RouterLink>
            </Button>
          )
        }
      />
      {scans.isPending ? (
        <LoadingState label="Loading scans…" />
      ) : scans.isError && !scans.data ? (
        <ErrorState title="Could not load scans" error={scans.error} onRetry={() => scans.refetch()} />
      ) : scans.data.total === 0 ? (
        <EmptyState
          icon={<ScanGridIcon />}
          title="No scans yet"
          description={
            user?.memberships.length
              ? 'Scans of your groups appear here as soon as someone in one of your groups creates one.'
              : 'Scans of your groups appear here. You are not in a group yet, so ask a group lead to add you.'
          }
        />
      ) : (
        <>
          {scans.isError && (
            <Box mb="4">
              <ErrorState title="Could not refresh scans; showing the last list" error={scans.error} onRetry={() => scans.refetch()} />
            </Box>
          )}
          {scans.data.items.length === 0 ? (
            <EmptyState title="This page is empty" description={`There are ${scans.data.total} scans, but none on page ${page}.`}>
              <Button asChild size="sm" variant="outline">
                <RouterLink to={paths.scans.getHref()}>Go to the first page</RouterLink>
              </Button>
            </EmptyState>
          ) : (
            <Panel>
              <ScansTable scans={scans.data.items} groupNames={groupNames} />
            </Panel>
          )}
          <Pager
            page={page}
            pageSize={scans.data.pageSize || PAGE_SIZE}
            total={scans.data.total}
            noun="scans"
            onPageChange={goTo}
            busy={scans.isPlaceholderData}
          />
        </>
      )}
    </Stack>
  );
}
