import { Alert } from '@chakra-ui/react';
import { Navigate, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeNextPath } from '@/features/auth/utils/safe-next-path';
import { useDocumentTitle } from '@/hooks/use-document-title';

export function SignInRoute() {
  useDocumentTitle('Sign in');
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const location = useLocation();
  const { data: user } = useMe();
  // Set by sign-out, which clears the cached user a moment after arriving here.
  const signedOut = (location.state as { signedOut?: boolean } | null)?.signedOut === true;
  const wanted = params.get('next');
  const next = safeNextPath(wanted, paths.home.getHref());

  // Already signed in (another tab, or the back button): go straight on.
  if (user && !signedOut) return <Navigate to={next} replace />;

  return (
    <AuthLayout title="Sign in">
      {signedOut && (
        <Alert.Root status="success" variant="subtle" mb="6" borderRadius="md">
          <Alert.Indicator />
          <Alert.Title fontWeight="400">You have signed out.</Alert.Title>
        </Alert.Root>
      )}
      {!signedOut && wanted && next !== paths.home.getHref() && (
        <Alert.Root status="info" variant="subtle" colorPalette="ink" mb="6" borderRadius="md">
          <Alert.Indicator />
          <Alert.Title fontWeight="400">Sign in to continue where you left off.</Alert.Title>
        </Alert.Root>
      )}
      <SignInForm onSuccess={() => navigate(next, { replace: true })} />
    </AuthLayout>
  );
}
