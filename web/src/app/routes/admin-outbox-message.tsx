import { Stack } from '@chakra-ui/react';
import { useParams } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useOutboxMessage } from '@/features/admin/api/get-outbox-message';
import { OutboxMessageView } from '@/features/admin/components/outbox-message-view';
import { RequireSiteAdmin } from '@/features/auth/components/require-site-admin';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function AdminOutboxMessageRoute() {
  return (
    <RequireSiteAdmin>
      <OutboxMessagePage messageId={useParams().messageId ?? ''} />
    </RequireSiteAdmin>
  );
}

function OutboxMessagePage({ messageId }: { messageId: string }) {
  const message = useOutboxMessage(messageId);
  useDocumentTitle(message.data?.subject ?? 'Message');
  const back = <AppLink to={paths.adminOutbox.getHref()}>Back to the outbox</AppLink>;
  if (message.isPending) return <LoadingState label="Loading the message…" />;
  if (message.isError) {
    return (
      <Stack>
        <PageHeader title="Message" actions={back} />
        <ErrorState title="Could not load this message" error={message.error} onRetry={() => message.refetch()} />
      </Stack>
    );
  }
  return (
    <Stack gap="0">
      <PageHeader title={message.data.subject || '(no subject)'} actions={back} />
      <OutboxMessageView message={message.data} />
    </Stack>
  );
}
