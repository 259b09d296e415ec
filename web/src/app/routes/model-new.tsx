import { Button, Stack } from '@chakra-ui/react';
import { lazy, Suspense } from 'react';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { UsersIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { groupsWithRole } from '@/features/models/utils/model-permissions';
import { useDocumentTitle } from '@/hooks/use-document-title';

// The form brings the expression checker (symbolic differentiation); it loads when a page needs it.
const ModelForm = lazy(() => import('@/features/models/components/model-form').then((module) => ({ default: module.ModelForm })));

export function ModelNewRoute() {
  useDocumentTitle('New model');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const me = useMe();
  const groups = groupsWithRole(me.data, 'member');
  const groupId = Number(params.get('group')) || undefined;

  return (
    <Stack gap="0">
      <PageHeader
        title="New model"
        description="Write V(φ) in the engine's syntax, declare its parameters and say where the field starts. The expression is checked as you type, by the same rules the scans use."
      />
      {me.isPending ? (
        <LoadingState label="Loading your groups…" />
      ) : groups.length === 0 ? (
        <EmptyState
          icon={<UsersIcon />}
          title="Only group members can add models"
          description="You are a viewer in your groups, or in none yet. Ask a group lead to make you a member; meanwhile the built-in families are there to explore."
        >
          <Button asChild size="sm" variant="outline">
            <RouterLink to={paths.models.getHref()}>Back to models</RouterLink>
          </Button>
        </EmptyState>
      ) : (
        <Suspense fallback={<LoadingState label="Loading the form…" />}>
          <ModelForm
            mode="create"
            groups={groups}
            groupId={groupId}
            cancelHref={paths.models.getHref()}
            onSaved={(model) => navigate(paths.model.getHref(model.id))}
          />
        </Suspense>
      )}
    </Stack>
  );
}
