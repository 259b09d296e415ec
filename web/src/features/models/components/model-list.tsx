import { SimpleGrid } from '@chakra-ui/react';
import type { PotentialModel } from '@sixtyfold/shared';
import { ModelCard } from './model-card';

interface ModelListProps {
  models: PotentialModel[];
  groupNames: Map<number, string>;
}

export function ModelList({ models, groupNames }: ModelListProps) {
  return (
    <SimpleGrid columns={{ base: 1, lg: 2 }} gap="5" alignItems="start">
      {models.map((model) => (
        <ModelCard key={model.id} model={model} groupName={groupNames.get(model.groupId) ?? `Group ${model.groupId}`} />
      ))}
    </SimpleGrid>
  );
}
