import { Text } from '@chakra-ui/react';
import type { GroupMember } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useRemoveMember } from '../api/remove-member';

interface RemoveMemberDialogProps {
  groupId: number;
  groupName: string;
  /** The member to confirm; the dialog is open while there is one. */
  member: GroupMember | null;
  isMe: boolean;
  onClose: () => void;
  onRemoved: (userId: number) => void;
}

export function RemoveMemberDialog({ groupId, groupName, member, isMe, onClose, onRemoved }: RemoveMemberDialogProps) {
  const remove = useRemoveMember(groupId, { onSuccess: onRemoved });
  return (
    <ConfirmDialog
      open={member !== null}
      title={isMe ? `Leave ${groupName}?` : `Remove ${member?.displayName} from ${groupName}?`}
      confirmLabel={isMe ? 'Leave group' : 'Remove member'}
      busyLabel={isMe ? 'Leaving…' : 'Removing…'}
      busy={remove.isPending}
      error={remove.isError ? { title: isMe ? 'Could not leave the group' : 'Could not remove the member', message: remove.error.message } : null}
      onConfirm={() => member && remove.mutate(member.userId)}
      onClose={() => {
        remove.reset();
        onClose();
      }}
    >
      <Text>
        {isMe
          ? 'You lose access to its models and scans at once. A lead can invite you again later.'
          : `${member?.displayName} loses access to the group's models and scans at once. Their scans stay with the group. A lead can invite them again later.`}
      </Text>
    </ConfirmDialog>
  );
}
