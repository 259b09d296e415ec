import { Badge, Box, Button, Circle, HStack, Menu, Portal, Text } from '@chakra-ui/react';
import type { CurrentUser } from '@sixtyfold/shared';
import { Link as RouterLink } from 'react-router-dom';
import { ChevronDownIcon } from '@/components/ui/icons';
import { RoleBadge } from '@/components/ui/role-badge';
import { paths } from '@/config/paths';

function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  return ((parts[0]?.[0] ?? '') + (parts.length > 1 ? parts[parts.length - 1][0] : '')).toUpperCase() || '?';
}

interface UserMenuProps {
  user: CurrentUser;
  onSignOut: () => void;
  signingOut?: boolean;
}

export function UserMenu({ user, onSignOut, signingOut }: UserMenuProps) {
  return (
    <Menu.Root positioning={{ placement: 'bottom-end' }}>
      <Menu.Trigger asChild>
        <Button
          variant="ghost"
          size="sm"
          color="chrome.fg"
          px="2"
          _hover={{ bg: 'chrome.raised' }}
          _expanded={{ bg: 'chrome.raised' }}
          _focusVisible={{ outline: '2px solid', outlineColor: 'chrome.accent', outlineOffset: '2px' }}
          aria-label={`Account menu for ${user.displayName}`}
        >
          <Circle size="7" bg="ember.400" color="ink.950" fontSize="xs" fontWeight="700" aria-hidden="true">
            {initials(user.displayName)}
          </Circle>
          <Text as="span" hideBelow="sm" fontWeight="500" maxW="40" truncate>
            {user.displayName}
          </Text>
          <ChevronDownIcon boxSize="4" color="chrome.muted" />
        </Button>
      </Menu.Trigger>
      <Portal>
        <Menu.Positioner>
          <Menu.Content minW="72" py="2">
            <Box px="3" pt="1" pb="3">
              <HStack justify="space-between" gap="2">
                <Text fontWeight="600" color="ink.900">
                  {user.displayName}
                </Text>
                {user.siteRole === 'admin' && (
                  <Badge colorPalette="ember" variant="solid" size="sm">
                    Site admin
                  </Badge>
                )}
              </HStack>
              <Text fontSize="sm" color="fg.muted" truncate>
                {user.email}
              </Text>
            </Box>
            <Menu.Separator />
            <Menu.ItemGroup>
              <Menu.ItemGroupLabel color="fg.muted" fontSize="xs" textTransform="uppercase" letterSpacing="wider">
                Your groups
              </Menu.ItemGroupLabel>
              {user.memberships.length === 0 ? (
                <Text px="3" py="1.5" fontSize="sm" color="fg.muted">
                  You are not in a group yet. A group lead can add you.
                </Text>
              ) : (
                user.memberships.map((membership) => (
                  <Menu.Item key={membership.groupId} value={`group-${membership.groupId}`} asChild>
                    <RouterLink to={paths.group.getHref(membership.groupId)}>
                      <Text flex="1" truncate>
                        {membership.groupName}
                      </Text>
                      <RoleBadge role={membership.role} />
                    </RouterLink>
                  </Menu.Item>
                ))
              )}
            </Menu.ItemGroup>
            <Menu.Separator />
            <Menu.Item value="notifications" asChild>
              <RouterLink to={paths.notifications.getHref()}>Notifications</RouterLink>
            </Menu.Item>
            <Menu.Item value="preferences" asChild>
              <RouterLink to={paths.preferences.getHref()}>Preferences</RouterLink>
            </Menu.Item>
            <Menu.Item value="account" asChild>
              <RouterLink to={paths.account.getHref()}>Change password</RouterLink>
            </Menu.Item>
            <Menu.Item value="api-tokens" asChild>
              <RouterLink to={paths.tokens.getHref()}>API tokens</RouterLink>
            </Menu.Item>
            <Menu.Item value="sign-out" onSelect={onSignOut} disabled={signingOut}>
              {signingOut ? 'Signing out…' : 'Sign out'}
            </Menu.Item>
          </Menu.Content>
        </Menu.Positioner>
      </Portal>
    </Menu.Root>
  );
}
