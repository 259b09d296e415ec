import { Box, Button, HStack, Heading, Stack, Text } from '@chakra-ui/react';
import { useDeferredValue, useState } from 'react';
import { Link as RouterLink, useNavigate } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { CurveIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useModels } from '@/features/models/api/get-models';
import { FamilyList } from '@/features/models/components/family-list';
import { ImportModelDialog } from '@/features/models/components/import-model-dialog';
import { ModelList } from '@/features/models/components/model-list';
import { groupsWithRole } from '@/features/models/utils/model-permissions';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';

export function ModelsRoute() {
  useDocumentTitle('Models');
  const { data: user } = useMe();
  const models = useModels();
  const writableGroups = groupsWithRole(user, 'member');
  const canCreate = writableGroups.length > 0;
  const [importing, setImporting] = useState(false);
  const navigate = useNavigate();
  const showFamilies = useDeferredValue(true, false);

  return (
    <Stack gap="0">
      <PageHeader
        title="Models"
        description="Inflationary potentials V(φ): the families built into the engine and the models your groups have written. Open one to plot it and try a point in your browser."
        actions={
          canCreate && (
            <HStack gap="2" flexShrink="0">
              <Button variant="outline" onClick={() => setImporting(true)}>
                Import file
              </Button>
              <Button asChild colorPalette="ember">
                <RouterLink to={paths.modelNew.getHref()}>New model</RouterLink>
              </Button>
            </HStack>
          )
        }
      />
      <Stack gap="10">
        <Box as="section" aria-labelledby="models-families">
          <Heading as="h2" id="models-families" size="lg" color="ink.900" mb="1">
            Built-in families
          </Heading>
          <Text color="fg.muted" fontSize="sm" mb="4">
            Potentials from the literature, known to the engine by name; each knows where its field starts rolling.
          </Text>
          {showFamilies ? <FamilyList /> : <LoadingState label="Typesetting the families…" />}
        </Box>

        <Box as="section" aria-labelledby="models-groups">
          <Heading as="h2" id="models-groups" size="lg" color="ink.900" mb="1">
            Your groups’ models
          </Heading>
          <Text color="fg.muted" fontSize="sm" mb="4">
            Potentials written by members of your groups, with the parameters their scans vary.
          </Text>
          {models.isPending ? (
            <LoadingState label="Loading models…" />
          ) : models.isError ? (
            <ErrorState title="Could not load models" error={models.error} onRetry={() => models.refetch()} />
          ) : models.data.length === 0 ? (
            <EmptyState
              icon={<CurveIcon />}
              title="No models yet"
              description={
                canCreate
                  ? 'Write a potential of your own with New model; until then the built-in families above are ready for scans.'
                  : 'Models your groups define appear here. Members of a group can write one; the built-in families above are ready for scans.'
              }
            />
          ) : (
            <ModelList models={models.data} groupNames={groupNamesOf(user)} />
          )}
        </Box>
      </Stack>
      {canCreate && (
        <ImportModelDialog
          open={importing}
          groups={writableGroups}
          onClose={() => setImporting(false)}
          onImported={(model) => navigate(paths.model.getHref(model.id))}
        />
      )}
    </Stack>
  );
}
