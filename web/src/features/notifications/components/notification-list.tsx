import { Badge, Box, Button, HStack, Link, Stack, Text } from '@chakra-ui/react';
import type { NotificationDto } from '@sixtyfold/shared';
import { Link as RouterLink } from 'react-router-dom';
import { DateTime } from '@/components/ui/date-time';
import { KIND_LABELS, notificationTarget } from '../utils/notification-labels';

interface NotificationListProps {
  notifications: NotificationDto[];
  /** Marks one read: called when its link is opened, or by its own button when it has none. */
  onRead: (notification: NotificationDto) => void;
}

/** Notifications newest first; unread ones stand out and say so to screen readers too. */
export function NotificationList({ notifications, onRead }: NotificationListProps) {
  return (
    <Stack as="ul" gap="0" listStyleType="none" aria-label="Notifications">
      {notifications.map((n) => {
        const unread = n.readAt === null;
        const target = notificationTarget(n);
        return (
          <Box
            as="li"
            key={n.id}
            px={{ base: '4', md: '5' }}
            py="3"
            borderBottomWidth="1px"
            borderColor="border"
            _last={{ borderBottomWidth: 0 }}
            bg={unread ? 'ember.subtle/40' : undefined}
            borderStartWidth="3px"
            borderStartColor={unread ? 'ember.400' : 'transparent'}
          >
            <HStack justify="space-between" align="start" gap="3">
              <Stack gap="1" minW="0">
                <HStack gap="2" wrap="wrap" fontSize="sm">
                  <Badge size="sm" variant="subtle" colorPalette={n.kind === 'scan_failed' ? 'red' : 'gray'}>
                    {KIND_LABELS[n.kind]}
                  </Badge>
                  <DateTime iso={n.createdAt} color="fg.muted" />
                  {unread && (
                    <Text as="span" color="ember.fg" fontWeight="600">
                      Unread
                    </Text>
                  )}
                </HStack>
                {target ? (
                  <Link asChild fontWeight={unread ? '600' : '400'} color="ink.900" onClick={() => unread && onRead(n)}>
                    <RouterLink to={target}>{n.payload.title}</RouterLink>
                  </Link>
                ) : (
                  <Text fontWeight={unread ? '600' : '400'} color="ink.900">
                    {n.payload.title}
                  </Text>
                )}
                {n.payload.excerpt && (
                  <Text fontSize="sm" color="fg.muted" whiteSpace="pre-wrap" lineClamp={3}>
                    {n.payload.excerpt}
                  </Text>
                )}
              </Stack>
              {unread && !target && (
                <Button size="xs" variant="outline" onClick={() => onRead(n)}>
                  Mark read
                </Button>
              )}
            </HStack>
          </Box>
        );
      })}
    </Stack>
  );
}
