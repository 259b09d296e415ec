import { Button, Dialog } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { DialogFrame } from './dialog-frame';
import { FailureAlert } from './failure-alert';

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
    <DialogFrame
      role="alertdialog"
      open={open}
      title={title}
      onClose={onClose}
      footer={
        <>
          <Dialog.ActionTrigger asChild>
            <Button variant="outline">Keep it</Button>
          </Dialog.ActionTrigger>
          <Button colorPalette="red" loading={busy} loadingText={busyLabel} onClick={onConfirm}>
            {confirmLabel}
          </Button>
        </>
      }
    >
      {children}
      {error && (
        <FailureAlert title={error.title} mt="4">
          {error.message}
        </FailureAlert>
      )}
    </DialogFrame>
  );
}
