import { Text } from '@chakra-ui/react';
import type { AdminUser } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useSetUserDisabled } from '../api/set-user-disabled';

interface DisableUserDialogProps {
  /** The account to confirm; the dialog is open while there is one. */
  user: AdminUser | null;
  onClose: () => void;
}

export function DisableUserDialog({ user, onClose }: DisableUserDialogProps) {
  const disable = useSetUserDisabled({ onSuccess: onClose });
  return (
    <ConfirmDialog
      open={user !== null}
      title={`Disable ${user?.displayName}?`}
      confirmLabel="Disable account"
      busyLabel="Disabling…"
      busy={disable.isPending}
      error={disable.isError ? { title: 'Could not disable the account', message: disable.error.message } : null}
      onConfirm={() => user && disable.mutate({ userId: user.id, disabled: true })}
      onClose={() => {
        disable.reset();
        onClose();
      }}
    >
      <Text>
        {user?.email} is signed out everywhere at once, cannot sign in again, and its API tokens stop working. Its scans,
        models and memberships stay. You can re-enable the account later; it then signs in afresh.
      </Text>
    </ConfirmDialog>
  );
}
