import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import { pointCount } from '@sixtyfold/shared';
import { Link as RouterLink, useParams } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ScanGridIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { CommentThread } from '@/features/comments/components/comment-thread';
import { useGroup } from '@/features/groups/api/get-group';
import { useScan } from '@/features/scans/api/get-scan';
import { ScanPointView } from '@/features/scans/components/point/scan-point-view';
import { readWholeNumber } from '@/features/scans/utils/route-params';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function PointRoute() {
  const params = useParams();
  const scanId = readWholeNumber(params.scanId);
  const pointIndex = readWholeNumber(params.pointIndex);
  const scan = useScan(scanId ?? 0);
  const { data: user } = useMe();
  // Until the scan says which group it is in, there is no one to mention.
  const members = useGroup(scan.data?.groupId ?? 0, { enabled: !!scan.data }).data?.members;
  useDocumentTitle(pointIndex === null ? 'Point' : `Point ${pointIndex}${scan.data ? ` · ${scan.data.name}` : ''}`);

  if (scanId === null || pointIndex === null) {
    return <EmptyState icon={<ScanGridIcon />} title="No such point" description="Point addresses look like /scans/12/points/340." />;
  }
  if (scan.isPending) return <LoadingState label="Loading the scan…" />;
  if (scan.isError && !scan.data) return <ErrorState title={`Could not load scan ${scanId}`} error={scan.error} onRetry={() => scan.refetch()} />;

  const spec = scan.data.spec;
  const size = pointCount(spec);
  const back = (
    <AppLink to={paths.scan.getHref(scanId)} color="ink.fg">
      Back to the scan
    </AppLink>
  );
  if (pointIndex >= size) {
    return (
      <EmptyState
        icon={<ScanGridIcon />}
        title={`Point ${pointIndex} is outside this scan`}
        description={`“${scan.data.name}” has ${size.toLocaleString('en-US')} points, numbered 0 to ${(size - 1).toLocaleString('en-US')}.`}
      >
        {back}
      </EmptyState>
    );
  }

  const neighbour = (index: number, label: string) =>
    index >= 0 && index < size ? (
      <Button asChild size="sm" variant="outline">
        <RouterLink to={paths.point.getHref(scanId, index)}>{label}</RouterLink>
      </Button>
    ) : (
      <Button size="sm" variant="outline" disabled>
        {label}
      </Button>
    );

  return (
    <Stack gap="0">
      <PageHeader
        title={`Point ${pointIndex.toLocaleString('en-US')}`}
        description={
          <Text as="span">
            Of{' '}
            <AppLink to={paths.scan.getHref(scanId)} color="ink.fg">
              {scan.data.name}
            </AppLink>
            , {size.toLocaleString('en-US')} points, numbered with the last axis varying fastest.
          </Text>
        }
        actions={
          <HStack as="nav" aria-label="Neighbouring points" gap="2" wrap="wrap">
            {neighbour(pointIndex - 1, 'Previous point')}
            {neighbour(pointIndex + 1, 'Next point')}
            <Button asChild size="sm" variant="ghost">
              <RouterLink to={paths.scan.getHref(scanId)}>Back to the scan</RouterLink>
            </Button>
          </HStack>
        }
      />
      <ScanPointView key={`${scanId}-${pointIndex}`} scan={scan.data} spec={spec} pointIndex={pointIndex} />
      <Panel p={{ base: '4', md: '5' }} mt="5">
        <CommentThread
          key={`${scanId}-${pointIndex}`}
          scanId={scanId}
          groupId={scan.data.groupId}
          pointIndex={pointIndex}
          user={user}
          members={members}
          title="Discussion of this point"
        />
      </Panel>
    </Stack>
  );
}
