import { CloseButton, Dialog, Portal } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface DialogFrameProps {
  open: boolean;
  title: ReactNode;
  children: ReactNode;
  /** The buttons, the safe choice first. */
  footer: ReactNode;
  onClose: () => void;
  /** `alertdialog` for a question about something that cannot be undone. */
  role?: 'dialog' | 'alertdialog';
}

/** The one frame every modal dialog of the app uses: title, body, buttons, and a close button. */
export function DialogFrame({ open, title, children, footer, onClose, role = 'dialog' }: DialogFrameProps) {
  return (
    <Dialog.Root role={role} open={open} onOpenChange={(details) => !details.open && onClose()} placement="center">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>{title}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>{children}</Dialog.Body>
            <Dialog.Footer>{footer}</Dialog.Footer>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
