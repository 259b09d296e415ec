import { Table, Text } from '@chakra-ui/react';
import type { ScanSummary } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { DateTime } from '@/components/ui/date-time';
import { methodLabels } from '@/lib/method-labels';

interface ScanComparisonProps {
  scans: ScanSummary[];
  groupNames: Map<number, string>;
}

const mono = (value: ReactNode) => (
  <Text as="span" fontFamily="mono">
    {value}
  </Text>
);

/** The chosen scans as columns, one row per property, so differences line up. */
export function ScanComparison({ scans, groupNames }: ScanComparisonProps) {
  const rows: { label: string; value: (scan: ScanSummary) => ReactNode }[] = [
    { label: 'Group', value: (s) => groupNames.get(s.groupId) ?? `Group ${s.groupId}` },
    { label: 'Owner', value: (s) => s.ownerName },
    { label: 'Method', value: (s) => methodLabels[s.method] },
    { label: 'Grid points', value: (s) => mono(s.totalPoints.toLocaleString()) },
    { label: 'Failed points', value: (s) => mono(s.failedPoints.toLocaleString()) },
    { label: 'Tags', value: (s) => (s.tags.length ? s.tags.join(', ') : '—') },
    { label: 'Created', value: (s) => <DateTime iso={s.createdAt} /> },
    { label: 'Finished', value: (s) => <DateTime iso={s.finishedAt} /> },
  ];
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" showColumnBorder>
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader w="40">
              <Text srOnly>Property</Text>
            </Table.ColumnHeader>
            {scans.map((scan) => (
              <Table.ColumnHeader key={scan.id} color="ink.900" fontWeight="600" minW="48">
                {scan.name}
              </Table.ColumnHeader>
            ))}
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {rows.map((row) => (
            <Table.Row key={row.label}>
              <Table.Cell color="fg.muted" fontSize="sm">
                {row.label}
              </Table.Cell>
              {scans.map((scan) => (
                <Table.Cell key={scan.id}>{row.value(scan)}</Table.Cell>
              ))}
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
