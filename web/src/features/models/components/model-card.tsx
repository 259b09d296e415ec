import { Badge, Box, HStack, Heading, Stack, Text } from '@chakra-ui/react';
import type { PotentialModel } from '@sixtyfold/shared';
import { AppLink } from '@/components/ui/app-link';
import { Formula } from '@/components/ui/formula';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';

interface ModelCardProps {
  model: PotentialModel;
  groupName: string;
}

/** A group's model on the models list; the name leads to its page. */
export function ModelCard({ model, groupName }: ModelCardProps) {
  const headingId = `model-${model.id}`;
  return (
    <Panel as="article" aria-labelledby={headingId}>
      <Stack gap="3" p="5">
        <HStack justify="space-between" align="start" gap="3">
          <Heading as="h3" size="md" id={headingId} fontWeight="600">
            <AppLink to={paths.model.getHref(model.id)} color="ink.900">
              {model.name}
            </AppLink>
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
        <Box bg="dust.50" borderRadius="md" px="3" py="2.5" borderWidth="1px" borderColor="border.muted">
          <Formula expression={model.expression} lhs="V(\phi) =" block />
        </Box>
        <Text fontSize="sm" color="fg.muted">
          <Text as="span" fontWeight="500" color="fg">
            Parameters:
          </Text>{' '}
          <Text as="span" fontFamily="mono">
            {model.parameters.length ? model.parameters.map((p) => p.name).join(', ') : 'none'}
          </Text>
          {model.phiInit !== null && (
            <>
              {' · '}
              starts at φ_init ={' '}
              <Text as="span" fontFamily="mono">
                {model.phiInit}
              </Text>
            </>
          )}
        </Text>
      </Stack>
    </Panel>
  );
}
