import { Text } from '@chakra-ui/react';
import type { ConstraintRegion } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useDeleteConstraintRegion } from '../api/delete-constraint-region';

interface DeleteRegionDialogProps {
  /** The region to confirm; the dialog is open while there is one. */
  region: ConstraintRegion | null;
  groupName: string;
  onClose: () => void;
}

export function DeleteRegionDialog({ region, groupName, onClose }: DeleteRegionDialogProps) {
  const remove = useDeleteConstraintRegion({ onSuccess: onClose });
  return (
    <ConfirmDialog
      open={region !== null}
      title={`Delete the region “${region?.name}”?`}
      confirmLabel="Delete region"
      busyLabel="Deleting…"
      busy={remove.isPending}
      error={remove.isError ? { title: 'Could not delete the region', message: remove.error.message } : null}
      onConfirm={() => region && remove.mutate(region.id)}
      onClose={() => {
        remove.reset();
        onClose();
      }}
    >
      <Text>
        Its outline disappears from the n_s–r plane of every scan in {groupName}. Sixtyfold keeps no copy of the file: to draw it
        again, upload it again. The deletion is kept in the audit log.
      </Text>
    </ConfirmDialog>
  );
}
