import { Alert } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface FailureAlertProps extends Omit<Alert.RootProps, 'status' | 'title'> {
  title: ReactNode;
  children?: ReactNode;
}

/** The red box a form, dialog or action shows when a request failed: a title, then what happened. */
export function FailureAlert({ title, children, ...rootProps }: FailureAlertProps) {
  return (
    <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert" {...rootProps}>
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>{title}</Alert.Title>
        {children !== undefined && <Alert.Description>{children}</Alert.Description>}
      </Alert.Content>
    </Alert.Root>
  );
}
