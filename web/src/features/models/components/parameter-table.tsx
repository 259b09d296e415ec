import { Table, Text } from '@chakra-ui/react';
import type { ModelParameter } from '@sixtyfold/shared';
import { Formula } from '@/components/ui/formula';

const num = (value: number | undefined) => (value === undefined ? '—' : String(value));

interface ParameterTableProps {
  parameters: ModelParameter[];
  /** Names the table for screen readers, e.g. "Parameters of Natural inflation". */
  caption: string;
}

/** Each parameter with its symbol, default, the range scans offer, and what it means. */
export function ParameterTable({ parameters, caption }: ParameterTableProps) {
  if (parameters.length === 0) {
    return (
      <Text px="5" py="4" fontSize="sm" color="fg.muted">
        This potential has no free parameters.
      </Text>
    );
  }
  return (
    <Table.ScrollArea>
      <Table.Root size="sm">
        <Table.Caption srOnly>{caption}</Table.Caption>
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Parameter</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Default</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Range</Table.ColumnHeader>
            <Table.ColumnHeader>Meaning</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {parameters.map((p) => (
            <Table.Row key={p.name}>
              <Table.Cell whiteSpace="nowrap">
                <Formula expression={p.name} aria-hidden="true" mr="2" />
                <Text as="span" fontFamily="mono" fontSize="sm" color="fg.muted">
                  {p.name}
                </Text>
              </Table.Cell>
              <Table.Cell fontFamily="mono" textAlign="end">
                {p.defaultValue}
              </Table.Cell>
              <Table.Cell fontFamily="mono" textAlign="end" whiteSpace="nowrap" color="fg.muted">
                {p.min === undefined && p.max === undefined ? '—' : `${num(p.min)} … ${num(p.max)}`}
              </Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted" minW="48">
                {p.description || '—'}
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
