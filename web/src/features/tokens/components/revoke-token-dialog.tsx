import { Text } from '@chakra-ui/react';
import type { ApiToken } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useRevokeToken } from '../api/revoke-token';

interface RevokeTokenDialogProps {
  /** The token to confirm; the dialog is open while there is one. */
  token: ApiToken | null;
  onClose: () => void;
}

export function RevokeTokenDialog({ token, onClose }: RevokeTokenDialogProps) {
  const revoke = useRevokeToken({ onSuccess: onClose });
  return (
    <ConfirmDialog
      open={token !== null}
      title={`Revoke “${token?.name}”?`}
      confirmLabel="Revoke token"
      busyLabel="Revoking…"
      busy={revoke.isPending}
      error={revoke.isError ? { title: 'Could not revoke the token', message: revoke.error.message } : null}
      onConfirm={() => token && revoke.mutate(token.id)}
      onClose={() => {
        revoke.reset();
        onClose();
      }}
    >
      <Text>
        Scripts using{' '}
        <Text as="code" fontFamily="mono">
          {token?.prefix}…
        </Text>{' '}
        stop working at once. This cannot be undone; create a new token if you need one again.
      </Text>
    </ConfirmDialog>
  );
}
