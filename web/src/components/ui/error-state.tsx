import { Alert, Button } from '@chakra-ui/react';
import { ApiRequestError } from '@/lib/api-client';

/** What the user can do about a failed request, by status. */
export function errorAdvice(error: unknown): string {
  if (!(error instanceof ApiRequestError)) return 'Reload the page. If it happens again, tell your site administrator.';
  if (error.status === 0) return 'Check your network connection and that the Sixtyfold server is running, then try again.';
  if (error.status === 403) return 'Your account does not have access. Ask a group lead or a site administrator if you need it.';
  if (error.status === 404) return 'It may have been removed, or you are not a member of its group.';
  if (error.status === 429) return 'Too many requests in a short time; wait a minute and try again.';
  if (error.status >= 500) return 'Try again in a moment. If it keeps failing, tell your site administrator.';
  return 'Try again. If it keeps failing, tell your site administrator.';
}

interface ErrorStateProps {
  title: string;
  error: unknown;
  onRetry?: () => void;
}

export function ErrorState({ title, error, onRetry }: ErrorStateProps) {
  const raw = error instanceof Error ? error.message.trim() : '';
  // API messages may or may not end in a full stop; the advice follows as a second sentence.
  const message = !raw ? 'Something went wrong.' : /[.!?]$/.test(raw) ? raw : `${raw}.`;
  return (
    <Alert.Root status="error" variant="subtle" borderRadius="lg" alignItems="start" my="2" role="alert">
      <Alert.Indicator />
      <Alert.Content gap="1">
        <Alert.Title fontWeight="600">{title}</Alert.Title>
        <Alert.Description>
          {message} {errorAdvice(error)}
        </Alert.Description>
      </Alert.Content>
      {onRetry && (
        <Button size="sm" variant="outline" colorPalette="red" onClick={onRetry} alignSelf="center">
          Try again
        </Button>
      )}
    </Alert.Root>
  );
}
