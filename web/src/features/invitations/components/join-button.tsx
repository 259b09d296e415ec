import { Alert, Button, Stack } from '@chakra-ui/react';
import type { CurrentUser } from '@sixtyfold/shared';
import { useAcceptInvitation } from '../api/accept-invitation';

/** Accepting with the account that is signed in. */
export function JoinButton({ token, groupName, onJoined }: { token: string; groupName: string; onJoined: (user: CurrentUser) => void }) {
  const accept = useAcceptInvitation(token, { onSuccess: onJoined });
  return (
    <Stack gap="4">
      {accept.isError && (
        <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>Could not join</Alert.Title>
            <Alert.Description>{accept.error.message}</Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      <Button colorPalette="ember" loading={accept.isPending} loadingText="Joining…" onClick={() => accept.mutate({})}>
        Join {groupName}
      </Button>
    </Stack>
  );
}
