import { Box, HStack, List, Text } from '@chakra-ui/react';
import { failureColor } from '../../utils/failure-colors';
import { NOT_STORED_COLOR } from '../../utils/heatmap-figure';
import { failureLabel } from '@/lib/point-labels';
import type { FailureGroup } from '../../utils/grid-cells';

/** The reasons failed cells are coloured by, with how many cells each; failures carry no numbers. */
export function FailureLegend({ groups, missing = 0 }: { groups: FailureGroup[]; missing?: number }) {
  if (groups.length === 0 && missing === 0) return null;
  return (
    <HStack as="section" aria-label="Failed and missing cells" gap="4" wrap="wrap" fontSize="sm">
      {groups.length > 0 && (
        <Text color="fg.muted" fontWeight="500">
          Failed, by reason:
        </Text>
      )}
      <List.Root as="ul" display="flex" flexWrap="wrap" gap="3" listStyle="none">
        {groups.map((group) => (
          <List.Item key={group.reason} display="flex" alignItems="center" gap="1.5">
            <Box w="3" h="3" borderRadius="sm" bg={failureColor(group.reason)} aria-hidden="true" />
            <Text as="span" fontFamily="mono">
              {group.reason} ({group.count.toLocaleString('en-US')})
            </Text>
            {failureLabel(group.reason) !== group.reason && (
              <Text as="span" color="fg.muted">
                {failureLabel(group.reason)}
              </Text>
            )}
          </List.Item>
        ))}
        {missing > 0 && (
          <List.Item display="flex" alignItems="center" gap="1.5">
            <Box w="3" h="3" borderRadius="sm" bg={NOT_STORED_COLOR} aria-hidden="true" />
            <Text as="span">not stored yet ({missing.toLocaleString('en-US')})</Text>
          </List.Item>
        )}
      </List.Root>
    </HStack>
  );
}
