import { Alert, Button, CloseButton, Dialog, Portal, Text } from '@chakra-ui/react';
import type { ApiToken } from '@sixtyfold/shared';
import { useRevokeToken } from '../api/revoke-token';

interface RevokeTokenDialogProps {
  /** The token to confirm; the dialog is open while there is one. */
  token: ApiToken | null;
  onClose: () => void;
}

export function RevokeTokenDialog({ token, onClose }: RevokeTokenDialogProps) {
  const revoke = useRevokeToken({ onSuccess: onClose });
  const close = () => {
    revoke.reset();
    onClose();
  };

  return (
    <Dialog.Root role="alertdialog" open={token !== null} onOpenChange={(details) => !details.open && close()} placement="center">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Revoke “{token?.name}”?</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Text>
                Scripts using{' '}
                <Text as="code" fontFamily="mono">
                  {token?.prefix}…
                </Text>{' '}
                stop working at once. This cannot be undone; create a new token if you need one again.
              </Text>
              {revoke.isError && (
                <Alert.Root status="error" variant="subtle" borderRadius="md" mt="4" role="alert">
                  <Alert.Indicator />
                  <Alert.Content>
                    <Alert.Title>Could not revoke the token</Alert.Title>
                    <Alert.Description>{revoke.error.message}</Alert.Description>
                  </Alert.Content>
                </Alert.Root>
              )}
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Keep it</Button>
              </Dialog.ActionTrigger>
              <Button
                colorPalette="red"
                loading={revoke.isPending}
                loadingText="Revoking…"
                onClick={() => token && revoke.mutate(token.id)}
              >
                Revoke token
              </Button>
            </Dialog.Footer>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
