import { Box, Button, Float } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router-dom';
import { BellIcon } from '@/components/ui/icons';
import { paths } from '@/config/paths';
import { useUnreadCount } from '../api/get-unread-count';

/** The header's way to the notifications, with how many are unread (refreshed every 30 s while signed in). */
export function NotificationBell({ signedIn }: { signedIn: boolean }) {
  const count = useUnreadCount({ enabled: signedIn }).data?.unread ?? 0;
  const label = count > 0 ? `Notifications, ${count} unread` : 'Notifications';
  return (
    <Button
      asChild
      variant="ghost"
      size="sm"
      color="chrome.fg"
      px="2"
      position="relative"
      _hover={{ bg: 'chrome.raised' }}
      _focusVisible={{ outline: '2px solid', outlineColor: 'chrome.accent', outlineOffset: '2px' }}
    >
      <RouterLink to={paths.notifications.getHref()} aria-label={label} title={label}>
        <BellIcon boxSize="5" />
        {count > 0 && (
          <Float placement="top-end" offset="1.5">
            <Box
              aria-hidden="true"
              minW="4.5"
              h="4.5"
              px="1"
              borderRadius="full"
              bg="ember.400"
              color="ink.950"
              fontSize="2xs"
              fontWeight="700"
              lineHeight="4.5"
              textAlign="center"
            >
              {count > 99 ? '99+' : count}
            </Box>
          </Float>
        )}
      </RouterLink>
    </Button>
  );
}
