import { Button, Checkbox, HStack, Stack } from '@chakra-ui/react';
import { useSearchParams } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { BellIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Pager } from '@/components/ui/pager';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { useNotifications } from '@/features/notifications/api/get-notifications';
import { useUnreadCount } from '@/features/notifications/api/get-unread-count';
import { useMarkAllNotificationsRead } from '@/features/notifications/api/mark-all-notifications-read';
import { useMarkNotificationRead } from '@/features/notifications/api/mark-notification-read';
import { NotificationList } from '@/features/notifications/components/notification-list';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { readPage } from '@/lib/search-params';

const PAGE_SIZE = 20;

export function NotificationsRoute() {
  useDocumentTitle('Notifications');
  const [params, setParams] = useSearchParams();
  const page = readPage(params.get('page'));
  const unreadOnly = params.get('unread') === '1';
  const notifications = useNotifications({ page, pageSize: PAGE_SIZE, unreadOnly });
  const unread = useUnreadCount({ enabled: true }).data?.unread;
  const markRead = useMarkNotificationRead();
  const markAll = useMarkAllNotificationsRead();

  // The filter and the page live in the address (`?unread=1&page=2`), so Back and reloads keep them.
  const show = (changes: { unreadOnly?: boolean; page?: number }) => {
    const next = { unreadOnly, page, ...changes };
    const query = new URLSearchParams();
    if (next.unreadOnly) query.set('unread', '1');
    if (next.page > 1) query.set('page', String(next.page));
    setParams(query);
  };

  return (
    <Stack gap="0">
      <PageHeader
        title="Notifications"
        description={
          <>
            Finished scans, mentions and invitations, newest first. Whether they also reach you by e-mail is set in your{' '}
            <AppLink to={paths.preferences.getHref()} color="ink.fg" textDecoration="underline">
              preferences
            </AppLink>
            .
          </>
        }
        actions={
          <Button size="sm" variant="outline" onClick={() => markAll.mutate()} loading={markAll.isPending} loadingText="Marking…" disabled={unread === 0}>
            Mark all read
          </Button>
        }
      />
      <Stack gap="4">
        <HStack justify="space-between" wrap="wrap" gap="3">
          <Checkbox.Root checked={unreadOnly} onCheckedChange={(details) => show({ unreadOnly: details.checked === true, page: 1 })} colorPalette="ember" size="sm">
            <Checkbox.HiddenInput />
            <Checkbox.Control />
            <Checkbox.Label>Unread only</Checkbox.Label>
          </Checkbox.Root>
        </HStack>
        {markAll.isError && <ErrorState title="Could not mark them read" error={markAll.error} onRetry={() => markAll.mutate()} />}
        {markRead.isError && <ErrorState title="Could not mark the notification read" error={markRead.error} />}
        {notifications.isPending ? (
          <LoadingState label="Loading your notifications…" />
        ) : notifications.isError ? (
          <ErrorState title="Could not load your notifications" error={notifications.error} onRetry={() => notifications.refetch()} />
        ) : notifications.data.items.length === 0 ? (
          <EmptyState
            icon={<BellIcon />}
            title={unreadOnly ? 'Nothing unread' : 'No notifications yet'}
            description={unreadOnly ? 'You have read everything. Clear “Unread only” to see older ones.' : 'You hear here when your scans finish and when someone mentions you.'}
          />
        ) : (
          <>
            <Panel>
              <NotificationList notifications={notifications.data.items} onRead={(n) => markRead.mutate(n.id)} />
            </Panel>
            <Pager
              page={notifications.data.page}
              pageSize={notifications.data.pageSize}
              total={notifications.data.total}
              noun="notifications"
              busy={notifications.isPlaceholderData}
              onPageChange={(next) => show({ page: next })}
            />
          </>
        )}
      </Stack>
    </Stack>
  );
}
