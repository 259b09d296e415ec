import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import { lazy, Suspense, useState } from 'react';
import { Link as RouterLink, useNavigate, useParams } from 'react-router-dom';
import { DateTime } from '@/components/ui/date-time';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { ModelLoadError } from '@/features/models/components/model-load-error';
import { useModel } from '@/features/models/api/get-model';
import { modelExportHref } from '@/features/models/api/model-files';
import { DeleteModelDialog } from '@/features/models/components/delete-model-dialog';
import { PotentialSummary } from '@/features/models/components/potential-summary';
import { ScaleStatementPending } from '@/features/models/components/scale-statement';
import { hasGroupRole } from '@/features/models/utils/model-permissions';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';
import { NotFoundRoute } from './not-found';

// The explorer brings the engine and symbolic differentiation; they load when a page needs them.
const PotentialExplorer = lazy(() =>
  import('@/features/models/components/potential-explorer').then((module) => ({ default: module.PotentialExplorer })),
);
const DetectedScale = lazy(() =>
  import('@/features/models/components/detected-scale').then((module) => ({ default: module.DetectedScale })),
);

export function ModelRoute() {
  const modelId = Number(useParams().modelId);
  if (!Number.isInteger(modelId) || modelId <= 0) return <NotFoundRoute />;
  return <ModelPage modelId={modelId} />;
}

function ModelPage({ modelId }: { modelId: number }) {
  const navigate = useNavigate();
  const { data: user } = useMe();
  const model = useModel(modelId);
  const [deleting, setDeleting] = useState(false);
  useDocumentTitle(model.data?.name ?? 'Model');

  if (model.isPending) return <LoadingState label="Loading the model…" />;
  if (model.isError) return <ModelLoadError title="Model" error={model.error} onRetry={() => model.refetch()} />;

  const m = model.data;
  const groupName = groupNamesOf(user).get(m.groupId) ?? `Group ${m.groupId}`;
  const canEdit = hasGroupRole(user, m.groupId, 'member');
  const canDelete = hasGroupRole(user, m.groupId, 'lead');

  return (
    <Stack gap="0">
      <PageHeader
        title={m.name}
        description={m.description || undefined}
        actions={
          <HStack gap="2" flexShrink="0" wrap="wrap">
            <Button asChild variant="outline" size="sm">
              <RouterLink to={paths.models.getHref()}>All models</RouterLink>
            </Button>
            <Button asChild variant="outline" size="sm">
              <a href={modelExportHref(m.id)} download>
                Export file
              </a>
            </Button>
            {canEdit && (
              <Button asChild colorPalette="ink" size="sm">
                <RouterLink to={paths.modelEdit.getHref(m.id)}>Edit model</RouterLink>
              </Button>
            )}
            {canDelete && (
              <Button colorPalette="red" variant="outline" size="sm" onClick={() => setDeleting(true)}>
                Delete model
              </Button>
            )}
          </HStack>
        }
      />
      <Stack gap="8">
        <PotentialSummary
          name={m.name}
          expression={m.expression}
          parameters={m.parameters}
          facts={[
            { label: 'Group', value: groupName },
            {
              label: 'φ_init',
              value:
                m.phiInit === null ? (
                  <Text as="span" color="fg.muted">
                    not set; give one for each trial or scan
                  </Text>
                ) : (
                  <Text as="span" fontFamily="mono">
                    {m.phiInit}
                  </Text>
                ),
            },
            {
              label: 'Scale parameter',
              value: (
                <Suspense fallback={<ScaleStatementPending />}>
                  <DetectedScale expression={m.expression} parameters={m.parameters} />
                </Suspense>
              ),
            },
            {
              label: 'Last changed',
              value: <DateTime iso={m.updatedAt} />,
            },
          ]}
        />
        {/* A saved edit starts the explorer afresh from the new defaults. */}
        <Suspense fallback={<LoadingState label="Loading the plot and the engine…" />}>
          <PotentialExplorer key={`${m.id}-${m.updatedAt}`} subject={{ kind: 'model', model: m }} />
        </Suspense>
      </Stack>
      {canDelete && (
        <DeleteModelDialog
          model={m}
          open={deleting}
          onClose={() => setDeleting(false)}
          onDeleted={() => navigate(paths.models.getHref(), { replace: true })}
        />
      )}
    </Stack>
  );
}
