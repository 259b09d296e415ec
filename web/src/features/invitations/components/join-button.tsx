import { Button, Stack } from '@chakra-ui/react';
import type { CurrentUser } from '@sixtyfold/shared';
import { FailureAlert } from '@/components/ui/failure-alert';
import { useAcceptInvitation } from '../api/accept-invitation';

/** Accepting with the account that is signed in. */
export function JoinButton({ token, groupName, onJoined }: { token: string; groupName: string; onJoined: (user: CurrentUser) => void }) {
  const accept = useAcceptInvitation(token, { onSuccess: onJoined });
  return (
    <Stack gap="4">
      {accept.isError && (
        <FailureAlert title="Could not join">{accept.error.message}</FailureAlert>
      )}
      <Button colorPalette="ember" loading={accept.isPending} loadingText="Joining…" onClick={() => accept.mutate({})}>
        Join {groupName}
      </Button>
    </Stack>
  );
}
