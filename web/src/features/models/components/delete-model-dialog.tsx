import { Text } from '@chakra-ui/react';
import type { PotentialModel } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useDeleteModel } from '../api/delete-model';

interface DeleteModelDialogProps {
  model: PotentialModel;
  open: boolean;
  onClose: () => void;
  onDeleted: () => void;
}

export function DeleteModelDialog({ model, open, onClose, onDeleted }: DeleteModelDialogProps) {
  const remove = useDeleteModel({ onSuccess: onDeleted });
  return (
    <ConfirmDialog
      open={open}
      title={`Delete “${model.name}”?`}
      confirmLabel="Yes, delete"
      busyLabel="Deleting…"
      busy={remove.isPending}
      error={remove.isError ? { title: 'Could not delete the model', message: remove.error.message } : null}
      onConfirm={() => remove.mutate(model.id)}
      onClose={() => {
        remove.reset();
        onClose();
      }}
    >
      <Text>
        The model leaves your group’s list and can no longer be chosen for new scans. Scans that used it keep their results and
        their own copy of the expression. This cannot be undone.
      </Text>
    </ConfirmDialog>
  );
}
