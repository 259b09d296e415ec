import { Text } from '@chakra-ui/react';
import type { ScanDetail } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useDeleteScan } from '../api/delete-scan';

interface DeleteScanDialogProps {
  /** The scan to confirm; the dialog is open while there is one. */
  scan: ScanDetail | null;
  onClose: () => void;
  onDeleted: () => void;
}

export function DeleteScanDialog({ scan, onClose, onDeleted }: DeleteScanDialogProps) {
  const remove = useDeleteScan({ onSuccess: onDeleted });
  return (
    <ConfirmDialog
      open={scan !== null}
      title={`Delete “${scan?.name}”?`}
      confirmLabel="Delete scan and points"
      busyLabel="Deleting…"
      busy={remove.isPending}
      error={remove.isError ? { title: 'Could not delete the scan', message: remove.error.message } : null}
      onConfirm={() => scan && remove.mutate(scan.id)}
      onClose={() => {
        remove.reset();
        onClose();
      }}
    >
      <Text>
        The scan and all {scan?.totalPoints.toLocaleString('en-US')} of its points are removed for everyone in the group
        {scan && (scan.status === 'queued' || scan.status === 'running') ? ', and the work still queued stops' : ''}. This cannot
        be undone; the deletion is kept in the audit log.
      </Text>
    </ConfirmDialog>
  );
}
