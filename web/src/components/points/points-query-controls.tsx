import { Badge, Button, Field, HStack, Input, NativeSelect, Stack, Text } from '@chakra-ui/react';
import { FAILURE_CODES, type LikelihoodSetEntry } from '@sixtyfold/shared';
import { useState, type FormEvent } from 'react';
import { failureLabel } from '@/lib/point-labels';
import { filtersOf, withFilter, withoutFilter, type ColumnFilter, type PointsQuery } from '@/lib/points-query';
import { filterableColumns, type PointColumnDef } from './point-columns';

const STATUS_CHOICES = [
  { value: '', label: 'All points' },
  { value: 'ok', label: 'Computed' },
  { value: 'failed', label: 'Failed (any reason)' },
  ...FAILURE_CODES.map((code) => ({ value: code, label: `Failed: ${failureLabel(code)}` })),
];

interface QueryProps {
  query: PointsQuery;
  onQueryChange: (next: PointsQuery) => void;
}

/** A query with one key changed (an empty value removes it), back on page 1. */
function withKey(query: PointsQuery, key: string, value: string): PointsQuery {
  const next: PointsQuery = { ...query, [key]: value };
  if (!value) delete next[key];
  delete next.page;
  return next;
}

/** The status select, the likelihood set that judges the points ("Judge by") and the column filter form of a points table. */
export function PointsQueryControls({ query, onQueryChange, columns, likelihoodSets }: QueryProps & { columns: PointColumnDef[]; likelihoodSets: LikelihoodSetEntry[] | undefined }) {
  return (
    <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'end' }}>
      <Field.Root w={{ base: 'full', md: '56' }}>
        <Field.Label>Status</Field.Label>
        <NativeSelect.Root size="sm">
          <NativeSelect.Field bg="bg.panel" value={query.status ?? ''} onChange={(event) => onQueryChange(withKey(query, 'status', event.target.value))}>
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
              const next = withKey(query, 'likelihood', event.target.value);
              // Δχ² sorts only under a set.
              if (!event.target.value && next.sort === 'deltaChi2') delete next.sort;
              onQueryChange(next);
            }}
          >
            <option value="">No likelihood set</option>
            {(likelihoodSets ?? []).map((set) => (
              <option key={`${set.key}@${set.version}`} value={`${set.key}@${set.version}`}>
                {set.name} (v{set.version})
              </option>
            ))}
          </NativeSelect.Field>
          <NativeSelect.Indicator />
        </NativeSelect.Root>
      </Field.Root>
      <ColumnFilterForm columns={filterableColumns(columns)} onApply={(filter) => onQueryChange(withFilter(query, filter))} />
    </Stack>
  );
}

/** The query's column filters as badges, each removable, and "Clear filters" (which keeps the sort). Nothing without a filter. */
export function ActiveFilters({ query, onQueryChange, columns }: QueryProps & { columns: PointColumnDef[] }) {
  const filters = filtersOf(query);
  if (filters.length === 0) return null;
  return (
    <HStack gap="2" wrap="wrap" aria-label="Active filters">
      {filters.map((filter) => {
        const label = columns.find((c) => c.key === filter.column)?.label ?? filter.column;
        return (
          <Badge key={filter.column} variant="subtle" colorPalette="ink" size="md" gap="2" pr="1">
            <Text as="span" fontFamily="mono">
              {filter.min ?? '−∞'} ≤ {label} ≤ {filter.max ?? '∞'}
            </Text>
            <Button size="2xs" variant="ghost" aria-label={`Remove the filter on ${label}`} onClick={() => onQueryChange(withoutFilter(query, filter.column))}>
              ✕
            </Button>
          </Badge>
        );
      })}
      <Button size="xs" variant="ghost" onClick={() => onQueryChange(query.sort ? { sort: query.sort, order: query.order === 'desc' ? 'desc' : 'asc' } : {})}>
        Clear filters
      </Button>
    </HStack>
  );
}

/** Picks a column and a range for it; either bound may stay empty. */
function ColumnFilterForm({ columns, onApply }: { columns: PointColumnDef[]; onApply: (filter: ColumnFilter) => void }) {
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
