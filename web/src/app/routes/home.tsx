import { Badge, Box, Button, Grid, GridItem, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { groupRoleAtLeast, type CurrentUser } from '@sixtyfold/shared';
import { useQueries } from '@tanstack/react-query';
import { Link as RouterLink } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ScanGridIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { LiveScanCard } from '@/features/overview/components/live-scan-card';
import { RecentScanItem } from '@/features/overview/components/recent-scan-item';
import { getScanQueryOptions, isLive } from '@/features/scans/api/get-scan';
import { liveRefreshMs, useLiveScans } from '@/features/scans/api/get-live-scans';
import { useScans } from '@/features/scans/api/get-scans';
import { ScanProgress } from '@/features/scans/components/scan-progress';
import { ScanStatusBadge } from '@/features/scans/components/scan-status-badge';
import { useWorkerPool } from '@/features/workers/api/get-worker-pool';
import { WorkerPoolPanel } from '@/features/workers/components/worker-pool-panel';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';
import { scanPace } from '@/lib/scan-pace';

// Cards for live scans (each running one polls its details, so keep this modest) and finished ones shown.
const LIVE_LIMIT = 12;
const RECENT_SHOWN = 6;
// Live scans come first in the unfiltered list, so one page holds the newest finished ones after them.
const RECENT_PAGE_SIZE = 50;

const canLaunch = (user: CurrentUser | null | undefined) =>
  user?.siteRole === 'admin' || !!user?.memberships.some((m) => groupRoleAtLeast(m.role, 'member'));

export function HomeRoute() {
  useDocumentTitle('Overview');
  const { data: user } = useMe();
  const live = useLiveScans(LIVE_LIMIT);
  // Everything on the page follows the queue: quick while something computes, slow when idle.
  const refetchMs = liveRefreshMs(live.data);
  const groupNames = groupNamesOf(user);

  return (
    <Stack gap="0">
      <PageHeader
        title="Overview"
        description="What your groups are computing right now, how fast it goes, and what finished lately. It updates by itself."
        actions={
          canLaunch(user) && (
            <Button asChild colorPalette="ember" alignSelf={{ base: 'stretch', md: 'auto' }}>
              <RouterLink to={paths.scanNew.getHref()}>New scan</RouterLink>
            </Button>
          )
        }
      />
      <Grid templateColumns={{ base: '1fr', lg: 'minmax(0, 2fr) minmax(0, 1fr)' }} templateAreas={{ base: '"live" "pool" "recent"', lg: '"live pool" "recent pool"' }} gap="8" alignItems="start">
        <GridItem area="live" as="section" aria-labelledby="live-scans">
          <LiveScans live={live} groupNames={groupNames} launchable={canLaunch(user)} />
        </GridItem>
        <GridItem area="pool">
          <WorkerPool refetchMs={refetchMs} />
        </GridItem>
        <GridItem area="recent" as="section" aria-labelledby="recent-scans">
          <RecentScans refetchMs={refetchMs} groupNames={groupNames} />
        </GridItem>
      </Grid>
    </Stack>
  );
}

function LiveScans({ live, groupNames, launchable }: { live: ReturnType<typeof useLiveScans>; groupNames: Map<number, string>; launchable: boolean }) {
  const running = live.data?.running.items ?? [];
  const queued = live.data?.queued.items ?? [];
  // The list holds summaries; a running scan's rate and time left come from its details.
  const details = useQueries({ queries: running.map((scan) => getScanQueryOptions(scan.id)) });

  return (
    <Stack gap="4">
      <HStack justify="space-between" gap="3" wrap="wrap">
        <Heading as="h2" size="md" id="live-scans" color="ink.900">
          Running and queued
        </Heading>
        {live.data && (
          <HStack gap="2">
            <Badge colorPalette="ember" variant="subtle">
              {live.data.running.total} running
            </Badge>
            <Badge colorPalette="ink" variant="subtle">
              {live.data.queued.total} queued
            </Badge>
          </HStack>
        )}
      </HStack>
      {live.isPending ? (
        <LoadingState label="Loading running and queued scans…" />
      ) : live.isError && !live.data ? (
        <ErrorState title="Could not load running and queued scans" error={live.error} onRetry={() => live.refetch()} />
      ) : running.length + queued.length === 0 ? (
        <EmptyState
          icon={<ScanGridIcon />}
          title="Nothing is running"
          description="Scans of your groups appear here with their progress while workers compute them."
        >
          {launchable && (
            <Button asChild size="sm" variant="outline">
              <RouterLink to={paths.scanNew.getHref()}>Start a scan</RouterLink>
            </Button>
          )}
        </EmptyState>
      ) : (
        <>
          {live.isError && <ErrorState title="Could not refresh; showing the last known progress" error={live.error} onRetry={() => live.refetch()} />}
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
            {running.map((summary, i) => {
              const detail = details[i]?.data;
              const scan = detail ?? summary;
              return (
                <LiveScanCard
                  key={scan.id}
                  scan={scan}
                  groupName={groupNames.get(scan.groupId)}
                  pace={detail && scanPace(detail.progress)}
                  badge={<ScanStatusBadge status={scan.status} />}
                >
                  <ScanProgress scan={scan} />
                </LiveScanCard>
              );
            })}
            {queued.map((scan) => (
              <LiveScanCard key={scan.id} scan={scan} groupName={groupNames.get(scan.groupId)} badge={<ScanStatusBadge status={scan.status} />}>
                <ScanProgress scan={scan} />
              </LiveScanCard>
            ))}
          </SimpleGrid>
          {live.data.running.total + live.data.queued.total > running.length + queued.length && (
            <Text fontSize="sm" color="fg.muted">
              Showing the newest {LIVE_LIMIT} of each. <AppLink to={paths.scans.getHref()}>See every scan</AppLink>
            </Text>
          )}
        </>
      )}
    </Stack>
  );
}

function WorkerPool({ refetchMs }: { refetchMs: number }) {
  const pool = useWorkerPool({ refetchMs });
  if (pool.isPending) return <LoadingState label="Loading the worker pool…" />;
  if (pool.isError && !pool.data) return <ErrorState title="Could not load the worker pool" error={pool.error} onRetry={() => pool.refetch()} />;
  return (
    <Stack gap="3">
      {pool.isError && <ErrorState title="Could not refresh the worker pool; showing the last answer" error={pool.error} onRetry={() => pool.refetch()} />}
      <WorkerPoolPanel pool={pool.data} />
    </Stack>
  );
}

function RecentScans({ refetchMs, groupNames }: { refetchMs: number; groupNames: Map<number, string> }) {
  const scans = useScans({ pageSize: RECENT_PAGE_SIZE }, { refetchMs });
  const finished = (scans.data?.items ?? [])
    .filter((scan) => !isLive(scan) && scan.status !== 'draft' && scan.finishedAt)
    .sort((a, b) => (b.finishedAt ?? '').localeCompare(a.finishedAt ?? ''))
    .slice(0, RECENT_SHOWN);

  return (
    <Stack gap="4">
      <HStack justify="space-between" gap="3">
        <Heading as="h2" size="md" id="recent-scans" color="ink.900">
          Recently finished
        </Heading>
        <AppLink to={paths.scans.getHref()} fontSize="sm">
          All scans
        </AppLink>
      </HStack>
      {scans.isPending ? (
        <LoadingState label="Loading recent scans…" />
      ) : scans.isError && !scans.data ? (
        <ErrorState title="Could not load recent scans" error={scans.error} onRetry={() => scans.refetch()} />
      ) : finished.length === 0 ? (
        <EmptyState title="No finished scans yet" description="Completed, failed and cancelled scans of your groups show here, newest first." />
      ) : (
        <Panel>
          <Box as="ul" listStyleType="none" css={{ '& > li + li': { borderTopWidth: '1px', borderColor: 'border.muted' } }}>
            {finished.map((scan) => (
              <RecentScanItem key={scan.id} scan={scan} groupName={groupNames.get(scan.groupId)} badge={<ScanStatusBadge status={scan.status} />} />
            ))}
          </Box>
        </Panel>
      )}
    </Stack>
  );
}
