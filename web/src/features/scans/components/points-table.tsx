import { Box, Button, HStack, Stack, Table, Text } from '@chakra-ui/react';
import { variedInputs, type ScanDetail } from '@sixtyfold/shared';
import { useSearchParams } from 'react-router-dom';
import { PointCells, pointColumns, SortableHeader } from '@/components/points/point-columns';
import { PointsPageFooter } from '@/components/points/points-page-footer';
import { ActiveFilters, PointsQueryControls } from '@/components/points/points-query-controls';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { paths } from '@/config/paths';
import { filtersOf, readPointsQuery, type PointsQuery } from '@/lib/points-query';
import { readPage } from '@/lib/search-params';
import { useLikelihoodSets } from '../api/get-likelihood-sets';
import { isLive } from '../api/get-scan';
import { pointsExportHref, useScanPoints } from '../api/get-scan-points';

const PAGE_SIZE = 50;

/**
 * Every stored point of a scan, paged, sorted and filtered by the API; the query lives in the
 * address so a filtered view can be shared, and the downloads use the same filters.
 */
export function ScanPointsTable({ scan }: { scan: ScanDetail }) {
  const [params, setParams] = useSearchParams();
  const query: PointsQuery = { ...readPointsQuery(params), pageSize: String(PAGE_SIZE) };
  const sets = useLikelihoodSets();
  const columns = pointColumns(variedInputs(scan.spec), !!query.likelihood);
  const page = readPage(query.page ?? null);
  const points = useScanPoints(scan.id, query, isLive(scan));

  // Writes the table's part of the address, keeping the others (the page's view).
  const setQuery = (next: PointsQuery) =>
    setParams(
      (current) => {
        const copy = new URLSearchParams(current);
        for (const key of Object.keys(readPointsQuery(current))) copy.delete(key);
        for (const [key, value] of Object.entries(next)) if (key !== 'pageSize' && value !== '') copy.set(key, value);
        return copy;
      },
      { replace: true },
    );

  const hasFilters = filtersOf(query).length > 0 || !!query.status;

  return (
    <Stack gap="4">
      <Stack direction={{ base: 'column', lg: 'row' }} gap="4" justify="space-between" align={{ base: 'stretch', lg: 'end' }}>
        <PointsQueryControls query={query} onQueryChange={setQuery} columns={columns} likelihoodSets={sets.data} />
        <HStack gap="2" wrap="wrap">
          <Text fontSize="sm" color="fg.muted">
            Download {hasFilters ? 'the filtered points' : 'every point'}:
          </Text>
          <Button asChild size="sm" variant="outline">
            <a href={pointsExportHref(scan.id, query, 'csv')} download>
              CSV
            </a>
          </Button>
          <Button asChild size="sm" variant="outline">
            <a href={pointsExportHref(scan.id, query, 'json')} download>
              JSON
            </a>
          </Button>
          <Button asChild size="sm" variant="outline">
            <a href={pointsExportHref(scan.id, query, 'arrow')} download title="Apache Arrow IPC stream, for pandas (pyarrow) or polars">
              Arrow
            </a>
          </Button>
        </HStack>
      </Stack>

      <ActiveFilters query={query} onQueryChange={setQuery} columns={columns} />

      {points.isPending ? (
        <LoadingState label="Loading points…" />
      ) : points.isError && !points.data ? (
        <ErrorState title="Could not load the points" error={points.error} onRetry={() => points.refetch()} />
      ) : points.data.total === 0 ? (
        <EmptyState
          title={hasFilters ? 'No point matches these filters' : 'No points stored yet'}
          description={
            hasFilters
              ? 'Widen or remove a filter to see points again.'
              : isLive(scan)
                ? 'Points appear here as the workers store them.'
                : 'This scan has no stored points.'
          }
        />
      ) : (
        <Box>
          <Table.ScrollArea borderWidth="1px" borderColor="border" borderRadius="lg" bg="bg.panel">
            <Table.Root size="sm" aria-label="Points of the scan" css={{ '& td': { fontFamily: 'mono', fontSize: 'xs' } }}>
              <Table.Header>
                <Table.Row bg="bg.subtle">
                  <SortableHeader query={query} onQueryChange={setQuery} sortKey="pointIndex" label="Point" />
                  {columns.map((column) => (
                    <SortableHeader key={column.key} query={query} onQueryChange={setQuery} sortKey={column.key} label={column.label} textAlign="end" />
                  ))}
                  <Table.ColumnHeader>Status</Table.ColumnHeader>
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {points.data.items.map((point) => (
                  <Table.Row key={point.pointIndex}>
                    <Table.Cell>
                      <AppLink to={paths.point.getHref(scan.id, point.pointIndex)} aria-label={`Open point ${point.pointIndex}`}>
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
            pageSize={PAGE_SIZE}
            total={points.data.total}
            busy={points.isPlaceholderData}
            onPageChange={(next) => setQuery({ ...query, page: String(next) })}
          />
        </Box>
      )}
    </Stack>
  );
}
