import { Box, Button, Container, Flex, HStack, Link, Menu, Portal, SkipNavContent, SkipNavLink } from '@chakra-ui/react';
import type { CurrentUser } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { Link as RouterLink, NavLink } from 'react-router-dom';
import { MenuIcon } from '@/components/ui/icons';
import { Wordmark } from '@/components/ui/wordmark';
import { paths } from '@/config/paths';
import { navItemsFor } from './nav-items';
import { UserMenu } from './user-menu';

// Dark header: a light outline in the accent colour keeps keyboard focus visible.
const chromeFocus = { outline: '2px solid', outlineColor: 'chrome.accent', outlineOffset: '2px' };

interface AppLayoutProps {
  user: CurrentUser;
  onSignOut: () => void;
  signingOut?: boolean;
  /** Shown in the header before the account menu (the notification bell). */
  headerActions?: ReactNode;
  children: ReactNode;
}

export function AppLayout({ user, onSignOut, signingOut, headerActions, children }: AppLayoutProps) {
  const items = navItemsFor(user);
  return (
    <Flex direction="column" minH="100dvh">
      <SkipNavLink>Skip to content</SkipNavLink>
      <Box as="header" bg="chrome.bg" color="chrome.fg" borderBottomWidth="1px" borderColor="ink.800" position="sticky" top="0" zIndex="sticky">
        <Container maxW="7xl" h="14" display="flex" alignItems="center" gap="6">
          <Menu.Root>
            <Menu.Trigger asChild>
              <Button
                hideFrom="md"
                variant="ghost"
                size="sm"
                color="chrome.fg"
                _hover={{ bg: 'chrome.raised' }}
                _focusVisible={chromeFocus}
                aria-label="Open navigation"
                px="2"
              >
                <MenuIcon boxSize="5" />
              </Button>
            </Menu.Trigger>
            <Portal>
              <Menu.Positioner>
                <Menu.Content minW="56">
                  {items.map((item) => (
                    <Menu.Item
                      key={item.href}
                      value={item.href}
                      asChild
                      _currentPage={{ fontWeight: '600', color: 'ember.fg', bg: 'ember.subtle' }}
                    >
                      <NavLink to={item.href} end={item.href === paths.home.getHref() || item.href === paths.admin.getHref()}>{item.label}</NavLink>
                    </Menu.Item>
                  ))}
                </Menu.Content>
              </Menu.Positioner>
            </Portal>
          </Menu.Root>

          <Link asChild _focusVisible={chromeFocus} borderRadius="sm" _hover={{ textDecoration: 'none' }}>
            <RouterLink to={paths.home.getHref()} aria-label="Sixtyfold, go to the overview">
              <Wordmark />
            </RouterLink>
          </Link>

          <HStack as="nav" aria-label="Main" gap="1" hideBelow="md" h="full">
            {items.map((item) => (
              <Link
                key={item.href}
                asChild
                h="full"
                px="3"
                fontWeight="500"
                fontSize="sm"
                color="chrome.muted"
                borderBottomWidth="2px"
                borderColor="transparent"
                _hover={{ color: 'chrome.fg', textDecoration: 'none' }}
                _currentPage={{ color: 'chrome.fg', borderColor: 'ember.400' }}
                _focusVisible={chromeFocus}
              >
                <NavLink to={item.href} end={item.href === paths.home.getHref() || item.href === paths.admin.getHref()}>{item.label}</NavLink>
              </Link>
            ))}
          </HStack>

          <HStack ms="auto" gap="1">
            {headerActions}
            <UserMenu user={user} onSignOut={onSignOut} signingOut={signingOut} />
          </HStack>
        </Container>
      </Box>
      <SkipNavContent />
      <Box as="main" flex="1" py={{ base: '6', md: '10' }}>
        <Container maxW="7xl">{children}</Container>
      </Box>
      <Box as="footer" borderTopWidth="1px" borderColor="border" py="4">
        <Container maxW="7xl" fontSize="xs" color="fg.subtle">
          Sixtyfold · parameter scans of inflationary potentials
        </Container>
      </Box>
    </Flex>
  );
}
