import { Button, HStack } from '@chakra-ui/react';
import { Link as RouterLink, useLocation } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { CompassIcon } from '@/components/ui/icons';
import { paths } from '@/config/paths';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function NotFoundRoute() {
  useDocumentTitle('Not found');
  const { pathname } = useLocation();
  return (
    <EmptyState
      icon={<CompassIcon />}
      title="Nothing at this address"
      description={`There is no page at ${pathname}. The link may be mistyped or out of date.`}
    >
      <HStack gap="2">
        <Button asChild size="sm" colorPalette="ink">
          <RouterLink to={paths.scans.getHref()}>Go to scans</RouterLink>
        </Button>
        <Button asChild size="sm" variant="outline">
          <RouterLink to={paths.models.getHref()}>Browse models</RouterLink>
        </Button>
      </HStack>
    </EmptyState>
  );
}
