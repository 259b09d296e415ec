import { Center } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { paths } from '@/config/paths';
import { useMe } from '../api/get-me';

/**
 * Renders children only for a signed-in user. Any 401 anywhere sets the cached user to null
 * (see lib/query-client.ts), which lands here and sends the browser to sign-in with `next`.
 */
export function ProtectedRoute({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();

  if (me.data) return children;
  if (me.data === null) {
    return <Navigate to={paths.signIn.getHref(location.pathname + location.search)} replace />;
  }
  if (me.isError) {
    return (
      <Center minH="100dvh" px="6">
        <ErrorState title="Could not check whether you are signed in" error={me.error} onRetry={() => me.refetch()} />
      </Center>
    );
  }
  return (
    <Center minH="100dvh">
      <LoadingState label="Checking your session…" />
    </Center>
  );
}
