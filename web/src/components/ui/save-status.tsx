import { Alert } from '@chakra-ui/react';
import { ApiRequestError } from '@/lib/api-client';

interface SaveStatusProps {
  /** The settings form's mutation. */
  mutation: { isError: boolean; isSuccess: boolean; error: Error | null };
  errorTitle: string;
}

/** Above a settings form: that the last save worked, or why it failed (a 400's field messages show beside the fields instead). */
export function SaveStatus({ mutation: { isError, isSuccess, error }, errorTitle }: SaveStatusProps) {
  if (isSuccess) {
    return (
      <Alert.Root status="success" variant="subtle" borderRadius="md">
        <Alert.Indicator />
        <Alert.Title fontWeight="400">Saved.</Alert.Title>
      </Alert.Root>
    );
  }
  if (!isError || !error || (error instanceof ApiRequestError && error.status === 400)) return null;
  return (
    <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>{errorTitle}</Alert.Title>
        <Alert.Description>{error.message}</Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}
