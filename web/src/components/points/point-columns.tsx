import { Box, Button, Table, Text } from '@chakra-ui/react';
import { POINT_OUTPUTS, type ScanPointDto } from '@sixtyfold/shared';
import { formatNumber } from '@/lib/format-number';
import { inputLabel, OUTPUT_LABELS } from '@/lib/point-labels';
import { toggledSort, type PointColumn, type PointsQuery } from '@/lib/points-query';

/** A column of a points table: its query key (an output, `input.<parameter>`, `deltaChi2`, `confidence`), its label and its value. */
export interface PointColumnDef {
  key: PointColumn;
  label: string;
  value: (point: ScanPointDto) => number | null;
}

/** With a likelihood set chosen: each point's Δχ² under it (sortable) and the confidence level that corresponds to. */
export const JUDGED_COLUMNS: PointColumnDef[] = [
  { key: 'deltaChi2', label: 'Δχ²', value: (p) => p.deltaChi2 ?? null },
  { key: 'confidence', label: 'Confidence', value: (p) => p.confidence ?? null },
];
/** Columns the API cannot sort or filter by. */
const DISPLAY_ONLY = new Set<PointColumn>(['confidence']);

/** The axis inputs, then the outputs that are not axes, then (when judged by a likelihood) Δχ² and the confidence level. */
export function pointColumns(axes: string[], judged: boolean): PointColumnDef[] {
  return [
    ...axes.map((parameter) => ({ key: `input.${parameter}`, label: inputLabel(parameter), value: (p: ScanPointDto) => p.inputs[parameter] ?? null })),
    // An output that is also an axis (N_* on an axis) would repeat the same number.
    ...POINT_OUTPUTS.filter((output) => !axes.includes(output)).map((output) => ({
      key: output,
      label: OUTPUT_LABELS[output],
      value: (p: ScanPointDto) => p[output],
    })),
    ...(judged ? JUDGED_COLUMNS : []),
  ];
}

/** The columns a filter may name: every one but the judged ones. */
export const filterableColumns = (columns: PointColumnDef[]) => columns.filter((column) => !JUDGED_COLUMNS.includes(column));

/**
 * A column header that sorts the table by `sortKey` (ascending first, then flipped), with `aria-sort`;
 * a display-only column's header is its label alone.
 */
export function SortableHeader({
  query, onQueryChange, sortKey, label, textAlign,
}: { query: PointsQuery; onQueryChange: (next: PointsQuery) => void; sortKey: PointColumn; label: string; textAlign?: 'end' }) {
  if (DISPLAY_ONLY.has(sortKey)) return <Table.ColumnHeader textAlign={textAlign}>{label}</Table.ColumnHeader>;
  const sorted = (query.sort ?? 'pointIndex') === sortKey;
  const order = query.order === 'desc' ? 'desc' : 'asc';
  return (
    <Table.ColumnHeader textAlign={textAlign} aria-sort={sorted ? (order === 'asc' ? 'ascending' : 'descending') : 'none'}>
      <Button
        variant="plain"
        size="xs"
        px="0"
        fontWeight="600"
        onClick={() => onQueryChange(toggledSort(query, sortKey))}
        aria-label={`Sort by ${label}${sorted ? (order === 'asc' ? ', now ascending' : ', now descending') : ''}`}
      >
        {label}
        <Box as="span" aria-hidden color={sorted ? 'ember.600' : 'fg.subtle'}>
          {sorted ? (order === 'asc' ? '↑' : '↓') : '↕'}
        </Box>
      </Button>
    </Table.ColumnHeader>
  );
}

/** A point's value in a column: a number, or a confidence level as a percentage. */
function PointValueCell({ column, point }: { column: PointColumnDef; point: ScanPointDto }) {
  const value = column.value(point);
  return <Table.Cell textAlign="end">{column.key === 'confidence' ? formatConfidence(value) : formatNumber(value)}</Table.Cell>;
}

/** A confidence level as a percentage, e.g. 0.954 → "95.4 %". */
function formatConfidence(value: number | null): string {
  return value === null ? '—' : `${(100 * value).toFixed(1)} %`;
}

/** "ok", or the failure code with its stored reason beneath. */
function PointStatusCell({ point }: { point: ScanPointDto }) {
  return (
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
  );
}

/** A point's cells after the ones that say where it is: one per column, then its status. */
export function PointCells({ columns, point }: { columns: PointColumnDef[]; point: ScanPointDto }) {
  return (
    <>
      {columns.map((column) => (
        <PointValueCell key={column.key} column={column} point={point} />
      ))}
      <PointStatusCell point={point} />
    </>
  );
}
