import { Badge, Box, Button, Field, HStack, Input, Link, NativeSelect, Stack, Table, Text } from '@chakra-ui/react';
import { FAILURE_CODES, POINT_OUTPUTS, variedInputs, type ScanDetail, type ScanPointDto, type StoredScanSpec } from '@sixtyfold/shared';
import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Pager } from '@/components/ui/pager';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format-number';
import { readPage } from '@/lib/search-params';
import { useLikelihoodSets } from '../api/get-likelihood-sets';
import { isLive } from '../api/get-scan';
import { pointsExportHref, useScanPoints, type PointsQuery } from '../api/get-scan-points';
import { failureLabel, inputLabel, OUTPUT_LABELS } from '../utils/point-columns';
import {
  filtersOf, readPointsQuery, toggledSort, withFilter, withoutFilter, type ColumnFilter, type PointColumn,
} from '../utils/points-query';

const PAGE_SIZE = 50;

const STATUS_CHOICES = [
  { value: '', label: 'All points' },
  { value: 'ok', label: 'Computed' },
  { value: 'failed', label: 'Failed (any reason)' },
  ...FAILURE_CODES.map((code) => ({ value: code, label: `Failed: ${failureLabel(code)}` })),
];

interface Column {
  key: PointColumn;
  label: string;
  value: (point: ScanPointDto) => number | null;
}

/** With a likelihood set chosen: each point's Δχ² under it (sortable) and the confidence level that corresponds to. */
const JUDGED_COLUMNS: Column[] = [
  { key: 'deltaChi2', label: 'Δχ²', value: (p) => p.deltaChi2 ?? null },
  { key: 'confidence', label: 'Confidence', value: (p) => p.confidence ?? null },
];
/** Columns the API cannot sort or filter by. */
const DISPLAY_ONLY = new Set<PointColumn>(['confidence']);

function columnsOf(spec: StoredScanSpec): Column[] {
  const axes = variedInputs(spec);
  return [
    ...axes.map((parameter) => ({ key: `input.${parameter}`, label: inputLabel(parameter), value: (p: ScanPointDto) => p.inputs[parameter] ?? null })),
    // An output that is also an axis (N_* on an axis) would repeat the same number.
    ...POINT_OUTPUTS.filter((output) => !axes.includes(output)).map((output) => ({
      key: output,
      label: OUTPUT_LABELS[output],
      value: (p: ScanPointDto) => p[output],
    })),
  ];
}

/**
 * Every stored point of a scan, paged, sorted and filtered by the API; the query lives in the
 * address so a filtered view can be shared, and the downloads use the same filters.
 */
export function ScanPointsTable({ scan }: { scan: ScanDetail }) {
  const spec = scan.spec;
  const [params, setParams] = useSearchParams();
  const query: PointsQuery = { ...readPointsQuery(params), pageSize: String(PAGE_SIZE) };
  const sets = useLikelihoodSets();
  const columns = [...columnsOf(spec), ...(query.likelihood ? JUDGED_COLUMNS : [])];
  const page = readPage(query.page ?? null);
  const points = useScanPoints(scan.id, query, isLive(scan));
  const filters = filtersOf(query);
  const sort = query.sort ?? 'pointIndex';
  const order = query.order === 'desc' ? 'desc' : 'asc';

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

  const ariaSort = (key: PointColumn) => (sort === key ? (order === 'asc' ? 'ascending' : 'descending') : 'none');
  const sortButton = (key: PointColumn, label: string) => (
    <Button
      variant="plain"
      size="xs"
      px="0"
      fontWeight="600"
      onClick={() => setQuery(toggledSort(query, key))}
      aria-label={`Sort by ${label}${sort === key ? (order === 'asc' ? ', now ascending' : ', now descending') : ''}`}
    >
      {label}
      <Box as="span" aria-hidden color={sort === key ? 'ember.600' : 'fg.subtle'}>
        {sort === key ? (order === 'asc' ? '↑' : '↓') : '↕'}
      </Box>
    </Button>
  );

  const hasFilters = filters.length > 0 || !!query.status;

  return (
    <Stack gap="4">
      <Stack direction={{ base: 'column', lg: 'row' }} gap="4" justify="space-between" align={{ base: 'stretch', lg: 'end' }}>
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'end' }}>
          <Field.Root w={{ base: 'full', md: '56' }}>
            <Field.Label>Status</Field.Label>
            <NativeSelect.Root size="sm">
              <NativeSelect.Field
                bg="bg.panel"
                value={query.status ?? ''}
                onChange={(event) => {
                  const next: PointsQuery = { ...query, status: event.target.value };
                  delete next.page;
                  setQuery(next);
                }}
              >
                {STATUS_CHOICES.map((choice) => (
                  <option key={choice.value} value={choice.value}>
                    {choice.label}
                  </option>
                ))}
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </Field.Root>
          <Field.Root w={{ base: 'full', md: '64' }}>
            <Field.Label>Judge by</Field.Label>
            <NativeSelect.Root size="sm">
              <NativeSelect.Field
                bg="bg.panel"
                aria-label="Likelihood set"
                value={query.likelihood ?? ''}
                onChange={(event) => {
                  const next: PointsQuery = { ...query, likelihood: event.target.value };
                  delete next.page;
                  // Δχ² sorts only under a set.
                  if (!event.target.value && next.sort === 'deltaChi2') delete next.sort;
                  setQuery(next);
                }}
              >
                <option value="">No likelihood set</option>
                {(sets.data ?? []).map((set) => (
                  <option key={`${set.key}@${set.version}`} value={`${set.key}@${set.version}`}>
                    {set.name} (v{set.version})
                  </option>
                ))}
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </Field.Root>
          <ColumnFilterForm columns={columns.filter((c) => !JUDGED_COLUMNS.includes(c))} onApply={(filter) => setQuery(withFilter(query, filter))} />
        </Stack>
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

      {filters.length > 0 && (
        <HStack gap="2" wrap="wrap" aria-label="Active filters">
          {filters.map((filter) => {
            const label = columns.find((c) => c.key === filter.column)?.label ?? filter.column;
            return (
              <Badge key={filter.column} variant="subtle" colorPalette="ink" size="md" gap="2" pr="1">
                <Text as="span" fontFamily="mono">
                  {filter.min ?? '−∞'} ≤ {label} ≤ {filter.max ?? '∞'}
                </Text>
                <Button size="2xs" variant="ghost" aria-label={`Remove the filter on ${label}`} onClick={() => setQuery(withoutFilter(query, filter.column))}>
                  ✕
                </Button>
              </Badge>
            );
          })}
          <Button size="xs" variant="ghost" onClick={() => setQuery(query.sort ? { sort: query.sort, order } : {})}>
            Clear filters
          </Button>
        </HStack>
      )}

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
                  <Table.ColumnHeader aria-sort={ariaSort('pointIndex')}>{sortButton('pointIndex', 'Point')}</Table.ColumnHeader>
                  {columns.map((column) => (
                    <Table.ColumnHeader key={column.key} aria-sort={DISPLAY_ONLY.has(column.key) ? undefined : ariaSort(column.key)} textAlign="end">
                      {DISPLAY_ONLY.has(column.key) ? column.label : sortButton(column.key, column.label)}
                    </Table.ColumnHeader>
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
                    {columns.map((column) => (
                      <Table.Cell key={column.key} textAlign="end">
                        {column.key === 'confidence' ? formatConfidence(column.value(point)) : formatNumber(column.value(point))}
                      </Table.Cell>
                    ))}
                    <Table.Cell fontFamily="body">
                      {point.status === 'ok' ? (
                        <Text as="span" color="fg.muted">
                          ok
                        </Text>
                      ) : (
                        <Text as="span" color="fg.error" title={point.failureReason ?? undefined}>
                          {point.status}
                          {point.failureReason && (
                            <Text as="span" display="block" color="fg.muted" fontSize="2xs" maxW="md" whiteSpace="normal">
                              {point.failureReason}
                            </Text>
                          )}
                        </Text>
                      )}
                    </Table.Cell>
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
          {points.isError && (
            <Text mt="2" fontSize="sm" color="fg.error">
              Could not refresh the points ({points.error.message}); showing the last page.{' '}
              <Link as="button" onClick={() => points.refetch()}>
                Try again
              </Link>
            </Text>
          )}
          <Pager
            page={page}
            pageSize={PAGE_SIZE}
            total={points.data.total}
            noun="points"
            busy={points.isPlaceholderData}
            onPageChange={(next) => setQuery({ ...query, page: String(next) })}
          />
        </Box>
      )}
    </Stack>
  );
}

/** A confidence level as a percentage, e.g. 0.954 → "95.4 %". */
function formatConfidence(value: number | null): string {
  return value === null ? '—' : `${(100 * value).toFixed(1)} %`;
}

/** Picks a column and a range for it; either bound may stay empty. */
function ColumnFilterForm({ columns, onApply }: { columns: Column[]; onApply: (filter: ColumnFilter) => void }) {
  const [column, setColumn] = useState(columns[0]?.key ?? 'ns');
  const [min, setMin] = useState('');
  const [max, setMax] = useState('');
  const invalid = (text: string) => text.trim() !== '' && !Number.isFinite(Number(text));
  const problem = invalid(min) ? 'The lower bound is not a number' : invalid(max) ? 'The upper bound is not a number' : null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (problem || (!min.trim() && !max.trim())) return;
    onApply({ column, min: min.trim() || undefined, max: max.trim() || undefined });
    setMin('');
    setMax('');
  };

  return (
    <form onSubmit={submit} aria-label="Filter a column">
      <Stack direction={{ base: 'column', sm: 'row' }} gap="2" align={{ base: 'stretch', sm: 'end' }}>
        <Field.Root w={{ base: 'full', sm: '44' }}>
          <Field.Label>Filter column</Field.Label>
          <NativeSelect.Root size="sm">
            <NativeSelect.Field bg="bg.panel" value={column} onChange={(event) => setColumn(event.target.value)}>
              {columns.map((c) => (
                <option key={c.key} value={c.key}>
                  {c.label}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </Field.Root>
        <Field.Root w={{ base: 'full', sm: '28' }} invalid={invalid(min)}>
          <Field.Label>From</Field.Label>
          <Input size="sm" bg="bg.panel" inputMode="decimal" value={min} onChange={(event) => setMin(event.target.value)} placeholder="min" />
        </Field.Root>
        <Field.Root w={{ base: 'full', sm: '28' }} invalid={invalid(max)}>
          <Field.Label>To</Field.Label>
          <Input size="sm" bg="bg.panel" inputMode="decimal" value={max} onChange={(event) => setMax(event.target.value)} placeholder="max" />
        </Field.Root>
        <Button type="submit" size="sm" variant="outline" disabled={!!problem || (!min.trim() && !max.trim())}>
          Apply filter
        </Button>
      </Stack>
      {problem && (
        <Text fontSize="xs" color="fg.error" mt="1" role="alert">
          {problem}
        </Text>
      )}
    </form>
  );
}
