import { Alert, Button, CloseButton, Dialog, Portal, Text } from '@chakra-ui/react';
import type { ScanDetail } from '@sixtyfold/shared';
import { useDeleteScan } from '../api/delete-scan';

interface DeleteScanDialogProps {
  /** The scan to confirm; the dialog is open while there is one. */
  scan: ScanDetail | null;
  onClose: () => void;
  onDeleted: () => void;
}

export function DeleteScanDialog({ scan, onClose, onDeleted }: DeleteScanDialogProps) {
  const remove = useDeleteScan({ onSuccess: onDeleted });
  const close = () => {
    remove.reset();
    onClose();
  };

  return (
    <Dialog.Root role="alertdialog" open={scan !== null} onOpenChange={(details) => !details.open && close()} placement="center">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Delete “{scan?.name}”?</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Text>
                The scan and all {scan?.totalPoints.toLocaleString('en-US')} of its points are removed for everyone in the group
                {scan && (scan.status === 'queued' || scan.status === 'running') ? ', and the work still queued stops' : ''}. This
                cannot be undone; the deletion is kept in the audit log.
              </Text>
              {remove.isError && (
                <Alert.Root status="error" variant="subtle" borderRadius="md" mt="4" role="alert">
                  <Alert.Indicator />
                  <Alert.Content>
                    <Alert.Title>Could not delete the scan</Alert.Title>
                    <Alert.Description>{remove.error.message}</Alert.Description>
                  </Alert.Content>
                </Alert.Root>
              )}
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Keep it</Button>
              </Dialog.ActionTrigger>
              <Button colorPalette="red" loading={remove.isPending} loadingText="Deleting…" onClick={() => scan && remove.mutate(scan.id)}>
                Delete scan and points
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
