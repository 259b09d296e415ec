import { Box, Code, DataList, Heading, Stack } from '@chakra-ui/react';
import type { ModelParameter } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { Formula } from '@/components/ui/formula';
import { Panel } from '@/components/ui/panel';
import { ParameterTable } from './parameter-table';

interface PotentialSummaryProps {
  name: string;
  expression: string;
  parameters: ModelParameter[];
  /** Label and value pairs shown under the formula: region, paper, group, start… */
  facts: { label: string; value: ReactNode }[];
}

/** The formula typeset, the expression as the engine reads it, the facts and the parameter table. */
export function PotentialSummary({ name, expression, parameters, facts }: PotentialSummaryProps) {
  return (
    <Box as="section" aria-labelledby="potential-summary">
      <Heading as="h2" id="potential-summary" size="lg" color="ink.900" mb="3">
        The potential
      </Heading>
      <Panel>
        <Stack gap="4" p={{ base: '4', md: '5' }}>
          <Box bg="dust.50" borderRadius="md" px="4" py="3" borderWidth="1px" borderColor="border.muted">
            <Formula expression={expression} lhs="V(\phi) =" block />
          </Box>
          <DataList.Root orientation="horizontal" size="md" gap="3">
            <DataList.Item>
              <DataList.ItemLabel minW="32">Expression</DataList.ItemLabel>
              <DataList.ItemValue>
                <Code fontFamily="mono" fontSize="sm" whiteSpace="pre-wrap" wordBreak="break-word" bg="transparent" p="0">
                  {expression}
                </Code>
              </DataList.ItemValue>
            </DataList.Item>
            {facts.map((fact) => (
              <DataList.Item key={fact.label}>
                <DataList.ItemLabel minW="32">{fact.label}</DataList.ItemLabel>
                <DataList.ItemValue>{fact.value}</DataList.ItemValue>
              </DataList.Item>
            ))}
          </DataList.Root>
        </Stack>
        <Box borderTopWidth="1px" borderColor="border.muted">
          <ParameterTable parameters={parameters} caption={`Parameters of ${name}`} />
        </Box>
      </Panel>
    </Box>
  );
}
