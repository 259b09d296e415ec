import { Flex, Heading, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface PageHeaderProps {
  title: string;
  description?: ReactNode;
  actions?: ReactNode;
}

export function PageHeader({ title, description, actions }: PageHeaderProps) {
  return (
    <Flex gap="4" align={{ base: 'start', md: 'end' }} justify="space-between" direction={{ base: 'column', md: 'row' }} mb="6">
      <Stack gap="1.5" maxW="3xl">
        <Heading as="h1" size="2xl" fontWeight="600" letterSpacing="-0.015em" color="ink.900">
          {title}
        </Heading>
        {description && (
          <Text color="fg.muted" fontSize="md">
            {description}
          </Text>
        )}
      </Stack>
      {actions}
    </Flex>
  );
}
