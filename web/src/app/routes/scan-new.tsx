import { Alert, Button, Stack } from '@chakra-ui/react';
import { groupRoleAtLeast, type ScanDetail } from '@sixtyfold/shared';
import { lazy, Suspense, useMemo, type ReactNode } from 'react';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LockIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useGroups } from '@/features/groups/api/get-groups';
import { useModels } from '@/features/models/api/get-models';
import { useScan } from '@/features/scans/api/get-scan';
import type { LaunchGroup } from '@/features/scans/components/scan-form/scan-form';
import { blankValues, copyOfSpec, withGroup } from '@/features/scans/components/scan-form/scan-form-edits';
import { useWorkerPool } from '@/features/workers/api/get-worker-pool';
import { workerSlots } from '@/features/workers/utils/worker-slots';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { readId } from '@/lib/search-params';

// The form (and what it validates and times with) loads with this page, not with the app.
const ScanForm = lazy(() => import('@/features/scans/components/scan-form/scan-form').then((m) => ({ default: m.ScanForm })));

export function ScanNewRoute() {
  useDocumentTitle('New scan');
  const [params] = useSearchParams();
  const fromId = readId(params.get('from'));
  return fromId ? <CopyOfScan key={fromId} scanId={fromId} /> : <NewScanPage />;
}

function Page({ description, children }: { description?: ReactNode; children: ReactNode }) {
  return (
    <Stack gap="0" maxW="4xl">
      <PageHeader
        title="New scan"
        description={description ?? 'Choose a model, the parameters to vary and how to find the pivot; the workers compute every point of the grid.'}
      />
      {children}
    </Stack>
  );
}

function CopyOfScan({ scanId }: { scanId: number }) {
  const source = useScan(scanId);
  if (source.isPending) {
    return (
      <Page>
        <LoadingState label="Loading the scan to copy…" />
      </Page>
    );
  }
  if (source.isError) {
    return (
      <Page>
        <ErrorState title={`Could not load scan ${scanId} to copy`} error={source.error} onRetry={() => source.refetch()} />
        <Button asChild variant="outline" size="sm" alignSelf="start" mt="2">
          <RouterLink to={paths.scanNew.getHref()}>Start from a blank form</RouterLink>
        </Button>
      </Page>
    );
  }
  return <NewScanPage source={source.data} />;
}

function NewScanPage({ source }: { source?: ScanDetail }) {
  const navigate = useNavigate();
  const { data: user } = useMe();
  const admin = user?.siteRole === 'admin';
  // Administrators may launch in any group; everyone else where they are at least a member.
  const allGroups = useGroups({ enabled: admin });
  const models = useModels();
  const pool = useWorkerPool();
  // Parsed once: a list scan's spec can hold 50,000 points, and the page re-renders on every pool poll.
  const copied = useMemo(() => (source ? copyOfSpec(source.spec, source.name) : null), [source]);

  if (models.isPending || (admin && allGroups.isPending)) {
    return (
      <Page>
        <LoadingState label="Loading your groups and models…" />
      </Page>
    );
  }
  if (models.isError || (admin && allGroups.isError)) {
    const retry = () => (models.isError ? models.refetch() : allGroups.refetch());
    return (
      <Page>
        <ErrorState title="Could not load your groups and models" error={models.error ?? allGroups.error} onRetry={retry} />
      </Page>
    );
  }

  const groups: LaunchGroup[] = admin
    ? (allGroups.data ?? []).map((g) => ({ id: g.id, name: g.name }))
    : (user?.memberships ?? []).filter((m) => groupRoleAtLeast(m.role, 'member')).map((m) => ({ id: m.groupId, name: m.groupName }));
  if (groups.length === 0) {
    return (
      <Page>
        <EmptyState
          icon={<LockIcon />}
          title="You cannot launch scans yet"
          description="Launching a scan needs the member role in a group. Ask a lead of your group to make you a member."
        />
      </Page>
    );
  }

  const start = copied?.values ?? blankValues(groups[0].id);
  const movedGroup = !groups.some((g) => g.id === start.groupId);
  const initialValues = movedGroup ? withGroup(start, groups[0].id, models.data) : start;
  const slots = pool.data ? workerSlots(pool.data) : pool.isError ? 'unavailable' : 'loading';

  return (
    <Page description={source ? `Starting from a copy of “${source.name}”: change what you need and launch it as a new scan.` : undefined}>
      {source && !copied && (
        <Alert.Root status="warning" variant="subtle" borderRadius="md" mb="6">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>The settings of “{source.name}” could not be read</Alert.Title>
            <Alert.Description>The form starts blank instead.</Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      {source && copied && movedGroup && (
        <Alert.Root status="info" variant="subtle" borderRadius="md" mb="6">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>The copy goes to {groups[0].name}</Alert.Title>
            <Alert.Description>“{source.name}” belongs to a group where you cannot launch scans; choose another group if you like.</Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      <Panel p={{ base: '4', md: '6' }}>
        <Suspense fallback={<LoadingState label="Loading the form…" />}>
          <ScanForm
            groups={groups}
            models={models.data}
            initialValues={initialValues}
            initialPoints={copied?.pointList}
            workerSlots={slots}
            onLaunched={(scan) => navigate(paths.scan.getHref(scan.id))}
          />
        </Suspense>
      </Panel>
    </Page>
  );
}
