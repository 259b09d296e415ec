import { Alert, Button, Clipboard, HStack, IconButton, Input, InputGroup, Stack, Text } from '@chakra-ui/react';
import type { CreatedApiToken } from '@sixtyfold/shared';

/** The secret of a token just created: shown this once, with a copy button. */
export function NewTokenNotice({ token, onDismiss }: { token: CreatedApiToken; onDismiss: () => void }) {
  return (
    <Alert.Root status="warning" variant="subtle" borderRadius="lg" alignItems="start" role="alert" aria-label="New API token">
      <Alert.Indicator />
      <Alert.Content gap="3" w="full">
        <Stack gap="1">
          <Alert.Title fontWeight="600">Copy “{token.name}” now: it is shown only once</Alert.Title>
          <Alert.Description>
            Sixtyfold keeps only a fingerprint of the token, so it cannot show it again. Store it like a password; if it
            is lost, revoke it and create another.
          </Alert.Description>
        </Stack>
        <Clipboard.Root value={token.token} w="full">
          <Clipboard.Label srOnly>Your new API token</Clipboard.Label>
          <InputGroup
            endElement={
              <Clipboard.Trigger asChild>
                <IconButton variant="surface" size="xs" me="-2" aria-label="Copy the token">
                  <Clipboard.Indicator />
                </IconButton>
              </Clipboard.Trigger>
            }
          >
            <Clipboard.Input asChild>
              <Input readOnly fontFamily="mono" fontSize="sm" bg="bg.panel" />
            </Clipboard.Input>
          </InputGroup>
          <Clipboard.Context>
            {(clipboard) => (
              <Text role="status" fontSize="sm" color="fg.muted" mt="1" minH="5">
                {clipboard.copied ? 'Copied to the clipboard.' : ''}
              </Text>
            )}
          </Clipboard.Context>
        </Clipboard.Root>
        <Text fontSize="sm" color="fg.muted">
          Use it in scripts as <Text as="code" fontFamily="mono">Authorization: Bearer {token.prefix}…</Text>
        </Text>
        <HStack>
          <Button size="sm" variant="outline" onClick={onDismiss}>
            I have copied it
          </Button>
        </HStack>
      </Alert.Content>
    </Alert.Root>
  );
}
