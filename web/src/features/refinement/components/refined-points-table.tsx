import { Stack, Table, Text } from '@chakra-ui/react';
import { ErrorState } from '@/components/ui/error-state';
import { Pager } from '@/components/ui/pager';
import { formatNumber } from '@/lib/format-number';
import { REFINED_POINTS_PAGE_SIZE, useRefinedPoints } from '../api/get-refined-points';

/** The parent's and every completed level's points in one table, each with its level (0: the grid itself). */
export function RefinedPointsTable({ scanId, axes, page, onPageChange }: { scanId: number; axes: string[]; page: number; onPageChange: (page: number) => void }) {
  const points = useRefinedPoints(scanId, page, true);
  if (points.isError) return <ErrorState title="Could not load the points of every level" error={points.error} onRetry={() => points.refetch()} />;
  if (!points.data) return <Text fontSize="sm" color="fg.muted">Loading the points of every level…</Text>;
  return (
    <Stack gap="2">
      <Table.ScrollArea borderWidth="1px" borderColor="border" borderRadius="lg" bg="bg.panel">
        <Table.Root size="sm" aria-label="Points of every level" css={{ '& td': { fontFamily: 'mono', fontSize: 'xs' } }}>
          <Table.Header>
            <Table.Row bg="bg.subtle">
              <Table.ColumnHeader>Level</Table.ColumnHeader>
              <Table.ColumnHeader>Scan</Table.ColumnHeader>
              <Table.ColumnHeader>Point</Table.ColumnHeader>
              {axes.map((axis) => (
                <Table.ColumnHeader key={axis} textAlign="end">{axis}</Table.ColumnHeader>
              ))}
              <Table.ColumnHeader textAlign="end">n_s</Table.ColumnHeader>
              <Table.ColumnHeader textAlign="end">r</Table.ColumnHeader>
              <Table.ColumnHeader>Status</Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {points.data.items.map((point) => (
              <Table.Row key={`${point.scanId}-${point.pointIndex}`}>
                <Table.Cell>{point.level}</Table.Cell>
                <Table.Cell>{point.scanId}</Table.Cell>
                <Table.Cell>{point.pointIndex}</Table.Cell>
                {axes.map((axis) => (
                  <Table.Cell key={axis} textAlign="end">{formatNumber(point.inputs[axis])}</Table.Cell>
                ))}
                <Table.Cell textAlign="end">{formatNumber(point.ns)}</Table.Cell>
                <Table.Cell textAlign="end">{formatNumber(point.r)}</Table.Cell>
                <Table.Cell>{point.status}</Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      <Pager page={page} pageSize={REFINED_POINTS_PAGE_SIZE} total={points.data.total} noun="points" onPageChange={onPageChange} busy={points.isFetching} />
    </Stack>
  );
}
