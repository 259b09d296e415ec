import { Badge, Box, Code, HStack, Heading, Stack, Table, Text } from '@chakra-ui/react';
import type { PotentialModel } from '@sixtyfold/shared';
import { Panel } from '@/components/ui/panel';

const num = (value: number | undefined) => (value === undefined ? '—' : String(value));

interface ModelCardProps {
  model: PotentialModel;
  groupName: string;
}

export function ModelCard({ model, groupName }: ModelCardProps) {
  return (
    <Panel as="article" aria-labelledby={`model-${model.id}`}>
      <Stack gap="4" p="5">
        <HStack justify="space-between" align="start" gap="3">
          <Heading as="h2" size="md" id={`model-${model.id}`} color="ink.900" fontWeight="600">
            {model.name}
          </Heading>
          <Badge colorPalette="ink" variant="subtle" size="sm" flexShrink="0">
            {groupName}
          </Badge>
        </HStack>
        {model.description && (
          <Text color="fg.muted" fontSize="sm">
            {model.description}
          </Text>
        )}
        <Box>
          <Text fontSize="xs" color="fg.muted" fontWeight="500" mb="1.5">
            Potential V(φ)
          </Text>
          <Code
            display="block"
            whiteSpace="pre-wrap"
            wordBreak="break-word"
            fontFamily="mono"
            fontSize="sm"
            px="3"
            py="2.5"
            bg="ink.900"
            color="ember.200"
            borderRadius="md"
          >
            {model.expression}
          </Code>
          {model.phiInit !== null && (
            <Text fontSize="xs" color="fg.muted" mt="1.5">
              Initial field value φ₀ ={' '}
              <Text as="span" fontFamily="mono">
                {model.phiInit}
              </Text>
            </Text>
          )}
        </Box>
      </Stack>
      {model.parameters.length === 0 ? (
        <Text px="5" pb="5" fontSize="sm" color="fg.muted">
          This potential has no free parameters.
        </Text>
      ) : (
        <Table.ScrollArea borderTopWidth="1px" borderColor="border.muted">
          <Table.Root size="sm">
            <Table.Caption srOnly>Parameters of {model.name}</Table.Caption>
            <Table.Header>
              <Table.Row bg="bg.subtle">
                <Table.ColumnHeader>Parameter</Table.ColumnHeader>
                <Table.ColumnHeader textAlign="end">Default</Table.ColumnHeader>
                <Table.ColumnHeader textAlign="end">Range</Table.ColumnHeader>
                <Table.ColumnHeader>Meaning</Table.ColumnHeader>
              </Table.Row>
            </Table.Header>
            <Table.Body>
              {model.parameters.map((p) => (
                <Table.Row key={p.name}>
                  <Table.Cell fontFamily="mono" fontWeight="500">
                    {p.name}
                  </Table.Cell>
                  <Table.Cell fontFamily="mono" textAlign="end">
                    {p.defaultValue}
                  </Table.Cell>
                  <Table.Cell fontFamily="mono" textAlign="end" whiteSpace="nowrap" color="fg.muted">
                    {p.min === undefined && p.max === undefined ? '—' : `${num(p.min)} … ${num(p.max)}`}
                  </Table.Cell>
                  <Table.Cell fontSize="sm" color="fg.muted">
                    {p.description || '—'}
                  </Table.Cell>
                </Table.Row>
              ))}
            </Table.Body>
          </Table.Root>
        </Table.ScrollArea>
      )}
    </Panel>
  );
}
