import { EmptyState as ChakraEmptyState, VStack } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface EmptyStateProps {
  icon?: ReactNode;
  title: string;
  description: ReactNode;
  children?: ReactNode;
}

export function EmptyState({ icon, title, description, children }: EmptyStateProps) {
  return (
    <ChakraEmptyState.Root borderWidth="1px" borderStyle="dashed" borderColor="border.emphasized" borderRadius="xl" bg="bg.panel">
      <ChakraEmptyState.Content>
        {icon && <ChakraEmptyState.Indicator color="ember.500">{icon}</ChakraEmptyState.Indicator>}
        <VStack textAlign="center" gap="1.5">
          <ChakraEmptyState.Title color="ink.900">{title}</ChakraEmptyState.Title>
          <ChakraEmptyState.Description maxW="md">{description}</ChakraEmptyState.Description>
        </VStack>
        {children}
      </ChakraEmptyState.Content>
    </ChakraEmptyState.Root>
  );
}
