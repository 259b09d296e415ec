import { Table, Text } from '@chakra-ui/react';
import type { EvaluateResponse } from '@sixtyfold/shared';
import { formatNumber } from '@/lib/format-number';

interface SlowRollCheckProps {
  slowRoll: EvaluateResponse;
  modes: EvaluateResponse;
}

const ROWS = [
  { key: 'ns', label: 'n_s', relative: false },
  { key: 'alphaS', label: 'α_s', relative: false },
  { key: 'r', label: 'r', relative: true },
  { key: 'As', label: 'A_s (V as given)', relative: true },
] as const;

/** How far first-order slow roll is from the mode equations at this one point. */
export function SlowRollCheck({ slowRoll, modes }: SlowRollCheckProps) {
  if (modes.status !== 'ok' || slowRoll.status !== 'ok') {
    const which = modes.status !== 'ok' ? modes : slowRoll;
    return (
      <Text color="fg.muted">
        No comparison: the {which === modes ? 'mode equations' : 'slow-roll evaluation'} answered {which.status} ({which.message}).
      </Text>
    );
  }
  const gap = (key: (typeof ROWS)[number]['key'], relative: boolean) => {
    const a = slowRoll[key] as number;
    const b = modes[key] as number;
    return relative ? `${(((a - b) / Math.abs(b)) * 100).toFixed(2)} %` : (a - b).toExponential(2);
  };
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" aria-label="Slow roll against the mode equations">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Output</Table.ColumnHeader>
            <Table.ColumnHeader>Slow roll (first order)</Table.ColumnHeader>
            <Table.ColumnHeader>Mode equations</Table.ColumnHeader>
            <Table.ColumnHeader>Slow roll is off by</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {ROWS.map((row) => (
            <Table.Row key={row.key}>
              <Table.Cell>{row.label}</Table.Cell>
              <Table.Cell fontFamily="mono">{formatNumber(slowRoll[row.key])}</Table.Cell>
              <Table.Cell fontFamily="mono">{formatNumber(modes[row.key])}</Table.Cell>
              <Table.Cell fontFamily="mono">{gap(row.key, row.relative)}</Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
