import { Button, Stack } from '@chakra-ui/react';
import { findFamily } from '@sixtyfold/shared';
import { lazy, Suspense } from 'react';
import { Link as RouterLink, useParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { CurveIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { PotentialSummary } from '@/features/models/components/potential-summary';
import { ScaleStatement } from '@/features/models/components/scale-statement';
import { useDocumentTitle } from '@/hooks/use-document-title';

// The explorer brings the engine and symbolic differentiation; they load when a page needs them.
const PotentialExplorer = lazy(() =>
  import('@/features/models/components/potential-explorer').then((module) => ({ default: module.PotentialExplorer })),
);

export function FamilyRoute() {
  const { familyKey = '' } = useParams();
  const family = findFamily(familyKey);
  useDocumentTitle(family?.name ?? 'Unknown family');

  const backToModels = (
    <Button asChild variant="outline" size="sm" flexShrink="0">
      <RouterLink to={paths.models.getHref()}>All models</RouterLink>
    </Button>
  );

  if (!family) {
    return (
      <EmptyState
        icon={<CurveIcon />}
        title="No built-in family by that name"
        description={`The engine has no family called “${familyKey}”. The models page lists the ones it knows.`}
      >
        {backToModels}
      </EmptyState>
    );
  }
  return (
    <Stack gap="0">
      <PageHeader
        title={family.name}
        description="A potential built into the engine: scans refer to it by its key, and the engine knows where its field starts."
        actions={backToModels}
      />
      <Stack gap="8">
        <PotentialSummary
          name={family.name}
          expression={family.expression}
          parameters={family.parameters}
          facts={[
            { label: 'Where it inflates', value: family.region },
            { label: 'Paper', value: family.reference },
            { label: 'Engine key', value: family.key },
            { label: 'Scale parameter', value: <ScaleStatement scale={family.scale} /> },
          ]}
        />
        <Suspense fallback={<LoadingState label="Loading the plot and the engine…" />}>
          <PotentialExplorer key={family.key} subject={{ kind: 'family', family }} />
        </Suspense>
      </Stack>
    </Stack>
  );
}
