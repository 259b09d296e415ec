import { Button, Table, Text } from '@chakra-ui/react';
import type { GroupStorage, ScanStorage } from '@sixtyfold/shared';
import { useState } from 'react';
import { AppLink } from '@/components/ui/app-link';
import { paths } from '@/config/paths';
import { formatBytes } from '@/lib/format-bytes';

type Direction = 'desc' | 'asc';

function useSizeOrder<T extends { bytes: number }>(rows: T[]) {
  const [direction, setDirection] = useState<Direction>('desc');
  const sorted = [...rows].sort((a, b) => (direction === 'desc' ? b.bytes - a.bytes : a.bytes - b.bytes));
  const header = (
    <Button
      size="xs"
      variant="ghost"
      onClick={() => setDirection(direction === 'desc' ? 'asc' : 'desc')}
      aria-label={`Sort by size, ${direction === 'desc' ? 'smallest' : 'largest'} first`}
    >
      Size {direction === 'desc' ? '↓' : '↑'}
    </Button>
  );
  return { sorted, header, direction };
}

const count = new Intl.NumberFormat('en');

export function GroupStorageTable({ groups }: { groups: GroupStorage[] }) {
  const { sorted, header, direction } = useSizeOrder(groups);
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" aria-label="Storage per group">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Group</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Scans</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Points</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end" aria-sort={direction === 'desc' ? 'descending' : 'ascending'}>
              {header}
            </Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Archives</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {sorted.map((g) => (
            <Table.Row key={g.groupId}>
              <Table.Cell fontWeight="500" color="ink.900">
                <AppLink to={paths.group.getHref(g.groupId)}>{g.groupName}</AppLink>
              </Table.Cell>
              <Table.Cell textAlign="end">{count.format(g.scans)}</Table.Cell>
              <Table.Cell textAlign="end">{count.format(g.points)}</Table.Cell>
              <Table.Cell textAlign="end">{formatBytes(g.bytes)}</Table.Cell>
              <Table.Cell textAlign="end" color="fg.muted">
                {g.archives} · {formatBytes(g.archiveBytes)}
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}

export function ScanStorageTable({ scans, groupNames }: { scans: ScanStorage[]; groupNames: Map<number, string> }) {
  const { sorted, header, direction } = useSizeOrder(scans);
  if (scans.length === 0) return <Text p="4" color="fg.muted">No scans are stored.</Text>;
  return (
    <Table.ScrollArea maxH="md">
      <Table.Root size="sm" stickyHeader aria-label="Storage per scan">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Scan</Table.ColumnHeader>
            <Table.ColumnHeader>Group</Table.ColumnHeader>
            <Table.ColumnHeader>Status</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Points</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end" aria-sort={direction === 'desc' ? 'descending' : 'ascending'}>
              {header}
            </Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {sorted.map((s) => (
            <Table.Row key={s.scanId}>
              <Table.Cell fontWeight="500" color="ink.900">
                <AppLink to={paths.scan.getHref(s.scanId)}>{s.name}</AppLink>
              </Table.Cell>
              <Table.Cell color="fg.muted">{groupNames.get(s.groupId) ?? `group ${s.groupId}`}</Table.Cell>
              <Table.Cell color="fg.muted">{s.status}</Table.Cell>
              <Table.Cell textAlign="end">{count.format(s.points)}</Table.Cell>
              <Table.Cell textAlign="end">{formatBytes(s.bytes)}</Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
