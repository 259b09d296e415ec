import { Box, Stack } from '@chakra-ui/react';
import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Pager } from '@/components/ui/pager';
import { Panel } from '@/components/ui/panel';
import { useOutbox } from '@/features/admin/api/get-outbox';
import { OutboxTable } from '@/features/admin/components/outbox-table';
import { RequireSiteAdmin } from '@/features/auth/components/require-site-admin';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { readPage } from '@/lib/search-params';

const PAGE_SIZE = 50;

export function AdminOutboxRoute() {
  useDocumentTitle('Mail outbox');
  return (
    <RequireSiteAdmin>
      <Stack gap="0">
        <PageHeader
          title="Mail outbox"
          description="Every e-mail Sixtyfold sent while it runs with the local mail catcher (development and tests), newest first. Open one to follow its links."
        />
        <OutboxList />
      </Stack>
    </RequireSiteAdmin>
  );
}

function OutboxList() {
  const [params, setParams] = useSearchParams();
  const page = readPage(params.get('page'));
  const outbox = useOutbox({ page, pageSize: PAGE_SIZE });

  if (outbox.isPending) return <LoadingState label="Loading messages…" />;
  if (outbox.isError && !outbox.data) return <ErrorState title="Could not load the outbox" error={outbox.error} onRetry={() => outbox.refetch()} />;
  if (outbox.data.total === 0) {
    return (
      <EmptyState
        title="No messages caught yet"
        description="Invitations and other e-mails appear here once they are sent. With a real mail relay configured, messages go out and are not kept here."
      />
    );
  }
  return (
    <Box>
      <Panel>
        <OutboxTable messages={outbox.data.items} />
      </Panel>
      <Pager
        page={page}
        pageSize={outbox.data.pageSize || PAGE_SIZE}
        total={outbox.data.total}
        noun="messages"
        onPageChange={(next) => setParams(next > 1 ? { page: String(next) } : {})}
        busy={outbox.isPlaceholderData}
      />
    </Box>
  );
}
