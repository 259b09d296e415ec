import { Link, Table } from '@chakra-ui/react';
import type { ScanArchive } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';
import { formatBytes } from '@/lib/format-bytes';
import { archiveDownloadHref } from '../api/get-archives';

export function ArchivesTable({ archives, groupNames }: { archives: ScanArchive[]; groupNames: Map<number, string> }) {
  return (
    <Table.ScrollArea maxH="md">
      <Table.Root size="sm" stickyHeader aria-label="Archives">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Scan</Table.ColumnHeader>
            <Table.ColumnHeader>Group</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Points</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Size</Table.ColumnHeader>
            <Table.ColumnHeader>Archived</Table.ColumnHeader>
            <Table.ColumnHeader>By</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">File</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {archives.map((a) => (
            <Table.Row key={a.id}>
              <Table.Cell fontWeight="500" color="ink.900">
                {a.scanName} <span title="scan id">#{a.scanId}</span>
              </Table.Cell>
              <Table.Cell color="fg.muted">{groupNames.get(a.groupId) ?? `group ${a.groupId}`}</Table.Cell>
              <Table.Cell textAlign="end">{a.points}</Table.Cell>
              <Table.Cell textAlign="end">{formatBytes(a.bytes)}</Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted">
                <DateTime iso={a.createdAt} />
              </Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted">
                {a.createdByName ?? 'retention policy'}
              </Table.Cell>
              <Table.Cell textAlign="end">
                <Link href={archiveDownloadHref(a.id)} download={a.fileName} color="ink.fg" textDecoration="underline" title={`sha256 ${a.sha256}`}>
                  Download
                </Link>
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
