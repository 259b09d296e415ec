import { Box, Stack, Table, Text } from '@chakra-ui/react';
import type { LikelihoodSetEntry } from '@sixtyfold/shared';
import { useState } from 'react';
import { PointCells, pointColumns, SortableHeader } from '@/components/points/point-columns';
import { PointsPageFooter } from '@/components/points/points-page-footer';
import { ActiveFilters, PointsQueryControls } from '@/components/points/points-query-controls';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { paths } from '@/config/paths';
import { filtersOf, type PointsQuery } from '@/lib/points-query';
import { readPage } from '@/lib/search-params';
import { REFINED_POINTS_PAGE_SIZE, useRefinedPoints } from '../api/get-refined-points';

/** The likelihood sets a table may judge by; the route passes the scans feature's hook in (features do not import each other). */
export type UseLikelihoodSets = () => { data: LikelihoodSetEntry[] | undefined };

/**
 * The parent's and every completed level's points in one table, each with its level (0: the grid
 * itself) and scan, sorted and filtered by the API with the points table's controls. The query is
 * this component's state, not the address: the table opens on demand under the lineage, and the
 * scan's own points tab owns the points keys of the address.
 */
export function RefinedPointsTable({ scanId, axes, useLikelihoodSets }: { scanId: number; axes: string[]; useLikelihoodSets: UseLikelihoodSets }) {
  const [query, setQuery] = useState<PointsQuery>({});
  const sets = useLikelihoodSets();
  const points = useRefinedPoints(scanId, query, true);
  const columns = pointColumns(axes, !!query.likelihood);
  const page = readPage(query.page ?? null);
  const hasFilters = filtersOf(query).length > 0 || !!query.status;

  return (
    <Stack gap="3" py="2">
      <PointsQueryControls query={query} onQueryChange={setQuery} columns={columns} likelihoodSets={sets.data} />
      <ActiveFilters query={query} onQueryChange={setQuery} columns={columns} />
      {points.isError && !points.data ? (
        <ErrorState title="Could not load the points of every level" error={points.error} onRetry={() => points.refetch()} />
      ) : !points.data ? (
        <Text fontSize="sm" color="fg.muted">
          Loading the points of every level…
        </Text>
      ) : points.data.total === 0 ? (
        <EmptyState
          title={hasFilters ? 'No point of any level matches these filters' : 'No points stored yet'}
          description={hasFilters ? 'Widen or remove a filter to see points again.' : 'The levels have no stored points.'}
        />
      ) : (
        <Box>
          <Table.ScrollArea borderWidth="1px" borderColor="border" borderRadius="lg" bg="bg.panel">
            <Table.Root size="sm" aria-label="Points of every level" css={{ '& td': { fontFamily: 'mono', fontSize: 'xs' } }}>
              <Table.Header>
                <Table.Row bg="bg.subtle">
                  {/* The API's default order, `pointIndex`, is level then point index across the chain. */}
                  <SortableHeader query={query} onQueryChange={setQuery} sortKey="pointIndex" label="Level" />
                  <Table.ColumnHeader>Scan</Table.ColumnHeader>
                  <Table.ColumnHeader>Point</Table.ColumnHeader>
                  {columns.map((column) => (
                    <SortableHeader key={column.key} query={query} onQueryChange={setQuery} sortKey={column.key} label={column.label} textAlign="end" />
                  ))}
                  <Table.ColumnHeader>Status</Table.ColumnHeader>
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {points.data.items.map((point) => (
                  <Table.Row key={`${point.scanId}-${point.pointIndex}`}>
                    <Table.Cell>{point.level}</Table.Cell>
                    <Table.Cell>{point.scanId}</Table.Cell>
                    <Table.Cell>
                      <AppLink to={paths.point.getHref(point.scanId, point.pointIndex)} aria-label={`Open point ${point.pointIndex} of scan ${point.scanId}`}>
                        {point.pointIndex}
                      </AppLink>
                    </Table.Cell>
                    <PointCells columns={columns} point={point} />
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
          <PointsPageFooter
            error={points.isError ? points.error : null}
            onRetry={() => points.refetch()}
            page={page}
            pageSize={REFINED_POINTS_PAGE_SIZE}
            total={points.data.total}
            busy={points.isPlaceholderData}
            onPageChange={(next) => setQuery({ ...query, page: String(next) })}
          />
        </Box>
      )}
    </Stack>
  );
}
