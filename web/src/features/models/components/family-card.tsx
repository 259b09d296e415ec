import { Box, Heading, Stack, Text } from '@chakra-ui/react';
import type { PotentialFamily } from '@sixtyfold/shared';
import { AppLink } from '@/components/ui/app-link';
import { Formula } from '@/components/ui/formula';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';

/** A built-in family on the models list: its formula, where it inflates and the paper. */
export function FamilyCard({ family }: { family: PotentialFamily }) {
  const headingId = `family-${family.key}`;
  return (
    <Panel as="article" aria-labelledby={headingId} display="flex" flexDirection="column">
      <Stack gap="3" p="5" flex="1">
        <Heading as="h3" size="md" id={headingId} fontWeight="600">
          <AppLink to={paths.family.getHref(family.key)} color="ink.900">
            {family.name}
          </AppLink>
        </Heading>
        <Box bg="dust.50" borderRadius="md" px="3" py="2.5" borderWidth="1px" borderColor="border.muted">
          <Formula expression={family.expression} lhs="V(\phi) =" block />
        </Box>
        <Text fontSize="sm" color="fg.muted">
          {family.region}
        </Text>
        <Text fontSize="sm" color="fg.muted" mt="auto">
          <Text as="span" fontWeight="500" color="fg">
            Parameters:
          </Text>{' '}
          <Text as="span" fontFamily="mono">
            {family.parameters.map((p) => p.name).join(', ')}
          </Text>
        </Text>
        <Text fontSize="xs" color="fg.muted" borderTopWidth="1px" borderColor="border.muted" pt="3">
          <Text as="span" fontWeight="500" color="fg">
            Reference:
          </Text>{' '}
          {family.reference}
        </Text>
      </Stack>
    </Panel>
  );
}
