import { Box, Heading, Stack, Text } from '@chakra-ui/react';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { useMe } from '@/features/auth/api/get-me';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function AccountRoute() {
  useDocumentTitle('Your account');
  const me = useMe();
  return (
    <Stack gap="0">
      <PageHeader title="Your account" description={me.data ? `Signed in as ${me.data.displayName} (${me.data.email}).` : undefined} />
      <Box as="section" aria-labelledby="account-password">
        <Stack gap="1" mb="3">
          <Heading as="h2" id="account-password" size="lg" color="ink.900">
            Password
          </Heading>
          <Text color="fg.muted" fontSize="sm">
            Changing it signs you out everywhere else; API tokens keep working until they expire or you revoke them.
          </Text>
        </Stack>
        <Panel p={{ base: '4', md: '6' }} maxW="2xl">
          <ChangePasswordForm />
        </Panel>
      </Box>
    </Stack>
  );
}
