import { Button, Stack } from '@chakra-ui/react';
import type { CurrentUser, ScanDetail, StoredScanSpec } from '@sixtyfold/shared';
import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ScanGridIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useCommentCounts } from '@/features/comments/api/get-comment-counts';
import { CommentThread } from '@/features/comments/components/comment-thread';
import { useRegionOverlay } from '@/features/constraint-regions/hooks/use-region-overlay';
import { useGroup } from '@/features/groups/api/get-group';
import { useModel } from '@/features/models/api/get-model';
import { RefineDialog } from '@/features/refinement/components/refine-dialog';
import { ScanLineage } from '@/features/refinement/components/scan-lineage';
import { useLikelihoodSets } from '@/features/scans/api/get-likelihood-sets';
import { useScan } from '@/features/scans/api/get-scan';
import { ScanActions } from '@/features/scans/components/scan-actions';
import { ScanHeader } from '@/features/scans/components/scan-header';
import { ScanViews } from '@/features/scans/components/scan-views';
import { useRefreshWhenFinished, useScanResultsRefresher } from '@/features/scans/hooks/use-refresh-when-finished';
import { readWholeNumber } from '@/features/scans/utils/route-params';
import { scanPermissions } from '@/features/scans/utils/scan-permissions';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';

export function ScanRoute() {
  const scanId = readWholeNumber(useParams().scanId);
  const navigate = useNavigate();
  const { data: user } = useMe();
  const scan = useScan(scanId ?? 0);
  useDocumentTitle(scan.data?.name ?? 'Scan');
  useRefreshWhenFinished(scan.data);
  const refreshResults = useScanResultsRefresher(scan.data?.id);
  const spec = scan.data?.spec;
  const model = useModel(spec?.model.kind === 'group' ? spec.model.modelId : null);
  const [refining, setRefining] = useState(false);

  if (scanId === null) {
    return <EmptyState icon={<ScanGridIcon />} title="No such scan" description="Scan addresses end in the scan's number, like /scans/12." />;
  }
  if (scan.isPending) return <LoadingState label="Loading the scan…" />;
  if (scan.isError && !scan.data) return <ErrorState title={`Could not load scan ${scanId}`} error={scan.error} onRetry={() => scan.refetch()} />;

  const groupName = groupNamesOf(user).get(scan.data.groupId) ?? `Group ${scan.data.groupId}`;
  return (
    <Stack gap="0">
      {scan.isError && <ErrorState title="Could not refresh the scan; showing what was loaded last" error={scan.error} onRetry={() => scan.refetch()} />}
      <ScanHeader
        scan={scan.data}
        spec={scan.data.spec}
        groupName={groupName}
        model={model}
        actions={
          <Stack gap="2" align={{ base: 'stretch', md: 'end' }}>
            {/* A completed grid, not itself a refinement level, may be refined by whoever may submit scans in its group. */}
            {scan.data.status === 'completed' && scan.data.spec.axes && !scan.data.spec.refinement && scanPermissions(scan.data, user).clone && (
              <Button size="sm" variant="outline" alignSelf={{ md: 'end' }} onClick={() => setRefining(true)}>
                Refine…
              </Button>
            )}
            <ScanActions scan={scan.data} user={user} groupName={groupName} onDeleted={() => navigate(paths.scans.getHref())} />
          </Stack>
        }
      />
      <ScanLineage
        scanId={scan.data.id}
        axes={(scan.data.spec.axes ?? []).map((axis) => axis.parameter).concat(scan.data.spec.pointList?.columns ?? [])}
        useLikelihoodSets={useLikelihoodSets}
        onLevelCompleted={refreshResults}
      />
      {refining && <RefineDialog scan={scan.data} onClose={() => setRefining(false)} onLaunched={(level) => navigate(paths.scan.getHref(level.id))} />}
      <ScanResults scan={scan.data} spec={scan.data.spec} user={user} />
    </Stack>
  );
}

/** The result views with the discussion composed in: the scan's thread as a tab, each point's in the heatmap drawer. */
function ScanResults({ scan, spec, user }: { scan: ScanDetail; spec: StoredScanSpec; user: CurrentUser | null | undefined }) {
  const counts = useCommentCounts(scan.id);
  const members = useGroup(scan.groupId).data?.members;
  const thread = (pointIndex: number | null) => (
    <CommentThread
      scanId={scan.id}
      groupId={scan.groupId}
      pointIndex={pointIndex}
      user={user}
      members={members}
      title={pointIndex === null ? 'Discussion' : 'Discussion of this point'}
    />
  );
  return (
    <ScanViews
      scan={scan}
      spec={spec}
      discussion={{ content: <Panel p={{ base: '4', md: '6' }}>{thread(null)}</Panel>, count: counts.data?.scan }}
      pointDiscussion={{ counts: counts.data?.points, render: thread }}
      useRegionOverlay={useRegionOverlay}
      canCheckReproducibility={scanPermissions(scan, user).reproduce}
    />
  );
}
