import { Stack } from '@chakra-ui/react';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { CurveIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { useMe } from '@/features/auth/api/get-me';
import { useModels } from '@/features/models/api/get-models';
import { ModelList } from '@/features/models/components/model-list';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';

export function ModelsRoute() {
  useDocumentTitle('Models');
  const { data: user } = useMe();
  const models = useModels();

  return (
    <Stack gap="0">
      <PageHeader
        title="Models"
        description="Inflationary potentials your groups have defined: the expression for V(φ) and the parameters a scan can vary."
      />
      {models.isPending ? (
        <LoadingState label="Loading models…" />
      ) : models.isError ? (
        <ErrorState title="Could not load models" error={models.error} onRetry={() => models.refetch()} />
      ) : models.data.length === 0 ? (
        <EmptyState
          icon={<CurveIcon />}
          title="No models yet"
          description="Potential models that your groups define appear here, ready to be used in scans."
        />
      ) : (
        <ModelList models={models.data} groupNames={groupNamesOf(user)} />
      )}
    </Stack>
  );
}
