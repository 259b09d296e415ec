import { Alert, Button, CloseButton, Dialog, Portal, Text } from '@chakra-ui/react';
import type { PotentialModel } from '@sixtyfold/shared';
import { useDeleteModel } from '../api/delete-model';

interface DeleteModelDialogProps {
  model: PotentialModel;
  open: boolean;
  onClose: () => void;
  onDeleted: () => void;
}

export function DeleteModelDialog({ model, open, onClose, onDeleted }: DeleteModelDialogProps) {
  const remove = useDeleteModel({ onSuccess: onDeleted });
  const close = () => {
    remove.reset();
    onClose();
  };

  return (
    <Dialog.Root role="alertdialog" open={open} onOpenChange={(details) => !details.open && close()} placement="center">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Delete “{model.name}”?</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Text>
                The model leaves your group’s list and can no longer be chosen for new scans. Scans that used it keep their results
                and their own copy of the expression. This cannot be undone.
              </Text>
              {remove.isError && (
                <Alert.Root status="error" variant="subtle" borderRadius="md" mt="4" role="alert">
                  <Alert.Indicator />
                  <Alert.Content>
                    <Alert.Title>Could not delete the model</Alert.Title>
                    <Alert.Description>{remove.error.message}</Alert.Description>
                  </Alert.Content>
                </Alert.Root>
              )}
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Keep it</Button>
              </Dialog.ActionTrigger>
              <Button colorPalette="red" loading={remove.isPending} loadingText="Deleting…" onClick={() => remove.mutate(model.id)}>
                Yes, delete
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
