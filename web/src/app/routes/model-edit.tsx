import { Button, Stack } from '@chakra-ui/react';
import { lazy, Suspense } from 'react';
import { Link as RouterLink, useNavigate, useParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { LockIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { ModelLoadError } from '@/features/models/components/model-load-error';
import { useModel } from '@/features/models/api/get-model';
import { hasGroupRole } from '@/features/models/utils/model-permissions';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';
import { NotFoundRoute } from './not-found';

// The form brings the expression checker (symbolic differentiation); it loads when a page needs it.
const ModelForm = lazy(() => import('@/features/models/components/model-form').then((module) => ({ default: module.ModelForm })));

export function ModelEditRoute() {
  const modelId = Number(useParams().modelId);
  if (!Number.isInteger(modelId) || modelId <= 0) return <NotFoundRoute />;
  return <ModelEditPage modelId={modelId} />;
}

function ModelEditPage({ modelId }: { modelId: number }) {
  const navigate = useNavigate();
  const { data: user } = useMe();
  const model = useModel(modelId);
  useDocumentTitle(model.data ? `Edit ${model.data.name}` : 'Edit model');

  if (model.isPending) return <LoadingState label="Loading the model…" />;
  if (model.isError) return <ModelLoadError title="Edit model" error={model.error} onRetry={() => model.refetch()} />;

  const m = model.data;
  const back = paths.model.getHref(m.id);
  if (!hasGroupRole(user, m.groupId, 'member')) {
    return (
      <EmptyState
        icon={<LockIcon />}
        title="Only members of its group can edit this model"
        description="You can view the model and try points on it. Ask a lead of its group to make you a member if you need to change it."
      >
        <Button asChild size="sm" variant="outline">
          <RouterLink to={back}>Back to the model</RouterLink>
        </Button>
      </EmptyState>
    );
  }
  return (
    <Stack gap="0">
      <PageHeader
        title={`Edit ${m.name}`}
        description="Scans already submitted keep the definition they were run with; new scans and trials use what you save here."
      />
      <Suspense fallback={<LoadingState label="Loading the form…" />}>
        <ModelForm
          mode="edit"
          model={m}
          groupName={groupNamesOf(user).get(m.groupId) ?? `Group ${m.groupId}`}
          cancelHref={back}
          onSaved={(saved) => navigate(paths.model.getHref(saved.id))}
        />
      </Suspense>
    </Stack>
  );
}
