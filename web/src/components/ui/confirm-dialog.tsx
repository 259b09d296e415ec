import { Alert, Button, CloseButton, Dialog, Portal } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface ConfirmDialogProps {
  open: boolean;
  title: ReactNode;
  /** What will happen, in full: who loses what, and whether it can be undone. */
  children: ReactNode;
  confirmLabel: string;
  busyLabel: string;
  busy: boolean;
  /** Why the last attempt failed, shown above the buttons; null when it did not. */
  error: { title: string; message: string } | null;
  onConfirm: () => void;
  onClose: () => void;
}

/** Asks before something that cannot be undone; the safe choice is the first button. */
export function ConfirmDialog({ open, title, children, confirmLabel, busyLabel, busy, error, onConfirm, onClose }: ConfirmDialogProps) {
  return (
    <Dialog.Root role="alertdialog" open={open} onOpenChange={(details) => !details.open && onClose()} placement="center">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>{title}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              {children}
              {error && (
                <Alert.Root status="error" variant="subtle" borderRadius="md" mt="4" role="alert">
                  <Alert.Indicator />
                  <Alert.Content>
                    <Alert.Title>{error.title}</Alert.Title>
                    <Alert.Description>{error.message}</Alert.Description>
                  </Alert.Content>
                </Alert.Root>
              )}
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Keep it</Button>
              </Dialog.ActionTrigger>
              <Button colorPalette="red" loading={busy} loadingText={busyLabel} onClick={onConfirm}>
                {confirmLabel}
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
