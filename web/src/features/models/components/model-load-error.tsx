import { Stack } from '@chakra-ui/react';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { ApiRequestError } from '@/lib/api-client';

/** A model page whose model did not load: absent (or hidden by group) is said apart from a failure. */
export function ModelLoadError({ title, error, onRetry }: { title: string; error: Error; onRetry: () => void }) {
  const notFound = error instanceof ApiRequestError && error.status === 404;
  return (
    <Stack gap="0">
      <PageHeader title={title} />
      <ErrorState
        title={notFound ? 'This model does not exist, or it belongs to a group you are not in' : 'Could not load this model'}
        error={error}
        onRetry={notFound ? undefined : onRetry}
      />
    </Stack>
  );
}
