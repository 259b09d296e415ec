import { Table, Text } from '@chakra-ui/react';
import type { ConstraintRegion } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';
import { RemoveButton } from '@/components/ui/remove-button';
import { confidenceLabel } from '@/lib/region-labels';

interface ConstraintRegionsTableProps {
  regions: ConstraintRegion[];
  canRemove: (region: ConstraintRegion) => boolean;
  onRemove: (region: ConstraintRegion) => void;
}

export function ConstraintRegionsTable({ regions, canRemove, onRemove }: ConstraintRegionsTableProps) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" aria-label="Constraint regions">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Name</Table.ColumnHeader>
            <Table.ColumnHeader>Confidence</Table.ColumnHeader>
            <Table.ColumnHeader>Source</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Vertices</Table.ColumnHeader>
            <Table.ColumnHeader>Uploaded</Table.ColumnHeader>
            <Table.ColumnHeader>
              <Text srOnly>Actions</Text>
            </Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {regions.map((region) => (
            <Table.Row key={region.id}>
              <Table.Cell fontWeight="500">{region.name}</Table.Cell>
              <Table.Cell fontFamily="mono">{confidenceLabel(region.confidenceLevel)}</Table.Cell>
              <Table.Cell color="fg.muted">{region.source}</Table.Cell>
              <Table.Cell textAlign="end" fontFamily="mono">
                {region.vertices.length.toLocaleString('en-US')}
              </Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted">
                <DateTime iso={region.createdAt} />
              </Table.Cell>
              <Table.Cell textAlign="end">
                {canRemove(region) && (
                  <RemoveButton label={`Delete ${region.name}`} onClick={() => onRemove(region)}>
                    Delete
                  </RemoveButton>
                )}
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
