import { Stack } from '@chakra-ui/react';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { usePreferences } from '@/features/notifications/api/get-preferences';
import { PreferencesForm } from '@/features/notifications/components/preferences-form';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function PreferencesRoute() {
  useDocumentTitle('Preferences');
  const preferences = usePreferences();
  return (
    <Stack gap="0">
      <PageHeader title="Preferences" description="How Sixtyfold tells you about finished scans, mentions and invitations." />
      {preferences.isPending ? (
        <LoadingState label="Loading your preferences…" />
      ) : preferences.isError ? (
        <ErrorState title="Could not load your preferences" error={preferences.error} onRetry={() => preferences.refetch()} />
      ) : (
        <Panel p={{ base: '4', md: '6' }} maxW="2xl">
          <PreferencesForm preferences={preferences.data} />
        </Panel>
      )}
    </Stack>
  );
}
