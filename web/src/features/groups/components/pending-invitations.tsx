import { Table, Text } from '@chakra-ui/react';
import type { Invitation } from '@sixtyfold/shared';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { DateTime } from '@/components/ui/date-time';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { RemoveButton } from '@/components/ui/remove-button';
import { RoleBadge } from '@/components/ui/role-badge';
import { useInvitations } from '../api/get-invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';

export function PendingInvitations({ groupId }: { groupId: number }) {
  const invitations = useInvitations(groupId);
  const [revoking, setRevoking] = useState<Invitation | null>(null);
  const revoke = useRevokeInvitation(groupId, { onSuccess: () => setRevoking(null) });

  if (invitations.isPending) return <LoadingState label="Loading invitations…" />;
  if (invitations.isError) return <ErrorState title="Could not load the invitations" error={invitations.error} onRetry={() => invitations.refetch()} />;
  if (invitations.data.length === 0) {
    return (
      <Text px="4" pb="4" color="fg.muted">
        No invitations are waiting for an answer.
      </Text>
    );
  }
  return (
    <>
      <Table.ScrollArea>
        <Table.Root size="sm" aria-label="Pending invitations">
          <Table.Header>
            <Table.Row bg="bg.subtle">
              <Table.ColumnHeader>E-mail</Table.ColumnHeader>
              <Table.ColumnHeader>Role</Table.ColumnHeader>
              <Table.ColumnHeader>Invited by</Table.ColumnHeader>
              <Table.ColumnHeader>Expires</Table.ColumnHeader>
              <Table.ColumnHeader>
                <Text srOnly>Actions</Text>
              </Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {invitations.data.map((invitation) => (
              <Table.Row key={invitation.id}>
                <Table.Cell fontWeight="500">{invitation.email}</Table.Cell>
                <Table.Cell>
                  <RoleBadge role={invitation.role} />
                </Table.Cell>
                <Table.Cell color="fg.muted">{invitation.invitedByName ?? '—'}</Table.Cell>
                <Table.Cell color="fg.muted">
                  <DateTime iso={invitation.expiresAt} />
                </Table.Cell>
                <Table.Cell textAlign="end">
                  <RemoveButton label={`Revoke the invitation to ${invitation.email}`} onClick={() => setRevoking(invitation)}>
                    Revoke
                  </RemoveButton>
                </Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      <ConfirmDialog
        open={revoking !== null}
        title={`Revoke the invitation to ${revoking?.email}?`}
        confirmLabel="Revoke invitation"
        busyLabel="Revoking…"
        busy={revoke.isPending}
        error={revoke.isError ? { title: 'Could not revoke the invitation', message: revoke.error.message } : null}
        onConfirm={() => revoking && revoke.mutate(revoking.id)}
        onClose={() => {
          revoke.reset();
          setRevoking(null);
        }}
      >
        <Text>The link in the e-mail stops working at once. You can invite the address again later.</Text>
      </ConfirmDialog>
    </>
  );
}
