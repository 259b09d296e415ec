import { HStack, Spinner, Text } from '@chakra-ui/react';

/** Spinner with words, announced politely to screen readers. */
export function LoadingState({ label }: { label: string }) {
  return (
    <HStack role="status" aria-live="polite" gap="3" py="10" justify="center" color="fg.muted">
      <Spinner size="sm" color="ember.500" borderWidth="2px" />
      <Text>{label}</Text>
    </HStack>
  );
}
