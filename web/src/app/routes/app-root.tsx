import { Box } from '@chakra-ui/react';
import { Outlet, useNavigate } from 'react-router-dom';
import { AppLayout } from '@/components/layouts/app-layout';
import { ErrorState } from '@/components/ui/error-state';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useLogout } from '@/features/auth/api/logout';
import { ProtectedRoute } from '@/features/auth/components/protected-route';
import { NotificationBell } from '@/features/notifications/components/notification-bell';

export function AppRoot() {
  return (
    <ProtectedRoute>
      <SignedInShell />
    </ProtectedRoute>
  );
}

function SignedInShell() {
  const { data: user } = useMe();
  const navigate = useNavigate();
  // flushSync commits the sign-in page before the cached user is cleared; otherwise the protected
  // route would see "no user" first and redirect with ?next= pointing back here.
  const logout = useLogout({
    onSuccess: () => navigate(paths.signIn.getHref(), { replace: true, flushSync: true, state: { signedOut: true } }),
  });
  if (!user) return null;

  return (
    <AppLayout user={user} onSignOut={() => logout.mutate()} signingOut={logout.isPending} headerActions={<NotificationBell signedIn={!!user} />}>
      {logout.isError && (
        <Box mb="6">
          <ErrorState title="Could not sign out" error={logout.error} onRetry={() => logout.mutate()} />
        </Box>
      )}
      <Outlet />
    </AppLayout>
  );
}
