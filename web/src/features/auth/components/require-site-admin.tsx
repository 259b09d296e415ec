import { Button, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { LockIcon } from '@/components/ui/icons';
import { paths } from '@/config/paths';
import { useMe } from '../api/get-me';

/** Site-admin pages: the API refuses them too (403), this just explains it up front. */
export function RequireSiteAdmin({ children }: { children: ReactNode }) {
  const { data: user } = useMe();
  if (user?.siteRole === 'admin') return children;
  return (
    <Stack py="6">
      <EmptyState
        icon={<LockIcon />}
        title="This area is for site administrators"
        description={
          <Text as="span">
            You are signed in as {user?.email ?? 'a regular user'}, which is not a site administrator account. If you
            need to manage users or read the audit log, ask one of your site administrators.
          </Text>
        }
      >
        <Button asChild colorPalette="ink" size="sm">
          <RouterLink to={paths.scans.getHref()}>Back to scans</RouterLink>
        </Button>
      </EmptyState>
    </Stack>
  );
}
