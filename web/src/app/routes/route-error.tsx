import { Alert, Box, Button, HStack } from '@chakra-ui/react';
import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { paths } from '@/config/paths';

/** Shown when a page throws while rendering, instead of React Router's developer screen. */
export function RouteError() {
  const error = useRouteError();
  const detail = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <Box maxW="2xl" mx="auto" my="16" px="6">
      <Alert.Root status="error" borderRadius="lg" alignItems="start">
        <Alert.Indicator />
        <Alert.Content gap="2">
          <Alert.Title>This page ran into a problem</Alert.Title>
          <Alert.Description>
            {detail}. Reload to try again; if it keeps happening, tell your site administrator what you were doing.
          </Alert.Description>
          <HStack gap="2" mt="2">
            <Button size="sm" colorPalette="red" onClick={() => window.location.reload()}>
              Reload
            </Button>
            <Button asChild size="sm" variant="outline">
              <a href={paths.scans.getHref()}>Go to scans</a>
            </Button>
          </HStack>
        </Alert.Content>
      </Alert.Root>
    </Box>
  );
}
