import { Alert } from '@chakra-ui/react';
import { isFieldRefusal } from '@/lib/form-errors';
import { FailureAlert } from './failure-alert';

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
  if (!isError || !error || isFieldRefusal(error)) return null;
  return <FailureAlert title={errorTitle}>{error.message}</FailureAlert>;
}
