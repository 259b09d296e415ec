import { SimpleGrid } from '@chakra-ui/react';
import { POTENTIAL_FAMILIES } from '@sixtyfold/shared';
import { memo } from 'react';
import { FamilyCard } from './family-card';

/** Every family the engine knows by name, in the engine's order; static, so it never re-renders. */
export const FamilyList = memo(function FamilyList() {
  return (
    <SimpleGrid columns={{ base: 1, md: 2, xl: 3 }} gap="5" alignItems="stretch">
      {POTENTIAL_FAMILIES.map((family) => (
        <FamilyCard key={family.key} family={family} />
      ))}
    </SimpleGrid>
  );
});
