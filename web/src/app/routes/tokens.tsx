import { Box, Code, Heading, Link, Stack, Text } from '@chakra-ui/react';
import type { ApiToken, CreatedApiToken } from '@sixtyfold/shared';
import { useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LockIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { env } from '@/config/env';
import { useTokens } from '@/features/tokens/api/get-tokens';
import { CreateTokenForm } from '@/features/tokens/components/create-token-form';
import { NewTokenNotice } from '@/features/tokens/components/new-token-notice';
import { RevokeTokenDialog } from '@/features/tokens/components/revoke-token-dialog';
import { TokensTable } from '@/features/tokens/components/tokens-table';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function TokensRoute() {
  useDocumentTitle('API tokens');
  const tokens = useTokens();
  // The secret lives only in this state: leaving the page forgets it, as the notice says.
  const [created, setCreated] = useState<CreatedApiToken | null>(null);
  const [revoking, setRevoking] = useState<ApiToken | null>(null);

  return (
    <Stack gap="0">
      <PageHeader
        title="API tokens"
        description={
          <>
            Tokens let your scripts and notebooks use Sixtyfold as you, with the roles you have in your groups at the
            time. Send one as <Code>Authorization: Bearer sfy_…</Code>; the{' '}
            <Link href={`${env.VITE_API_BASE_PATH}/docs`} color="ink.fg" textDecoration="underline">
              API reference
            </Link>{' '}
            lists every route. Every token expires, after 90 days unless you choose otherwise, and a read-only token
            can fetch but never change anything. Anyone holding a token can act as you, so revoke the ones you no
            longer use.
          </>
        }
      />
      <Stack gap="8">
        <Box as="section" aria-labelledby="tokens-create">
          <Heading as="h2" id="tokens-create" size="lg" color="ink.900" mb="3">
            New token
          </Heading>
          <Panel p={{ base: '4', md: '6' }}>
            <Stack gap="5">
              {created && <NewTokenNotice token={created} onDismiss={() => setCreated(null)} />}
              <CreateTokenForm onCreated={setCreated} />
            </Stack>
          </Panel>
        </Box>

        <Box as="section" aria-labelledby="tokens-list">
          <Heading as="h2" id="tokens-list" size="lg" color="ink.900" mb="3">
            Your tokens
          </Heading>
          {tokens.isPending ? (
            <LoadingState label="Loading your tokens…" />
          ) : tokens.isError ? (
            <ErrorState title="Could not load your tokens" error={tokens.error} onRetry={() => tokens.refetch()} />
          ) : tokens.data.length === 0 ? (
            <EmptyState
              icon={<LockIcon />}
              title="No API tokens yet"
              description={<Text as="span">Create one above to submit scans and download results from a script.</Text>}
            />
          ) : (
            <Panel>
              <TokensTable tokens={tokens.data} onRevoke={setRevoking} />
            </Panel>
          )}
        </Box>
      </Stack>
      <RevokeTokenDialog token={revoking} onClose={() => setRevoking(null)} />
    </Stack>
  );
}
