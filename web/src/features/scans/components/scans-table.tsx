import { Badge, HStack, Stack, Table, Text } from '@chakra-ui/react';
import type { ScanSummary } from '@sixtyfold/shared';
import { useNavigate } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { DateTime } from '@/components/ui/date-time';
import { paths } from '@/config/paths';
import { methodLabels } from '@/lib/method-labels';
import { ScanProgress } from './scan-progress';
import { ScanStatusBadge } from './scan-status-badge';

interface ScansTableProps {
  scans: ScanSummary[];
  groupNames: Map<number, string>;
}

export function ScansTable({ scans, groupNames }: ScansTableProps) {
  const navigate = useNavigate();
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" interactive>
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Name</Table.ColumnHeader>
            <Table.ColumnHeader>Group</Table.ColumnHeader>
            <Table.ColumnHeader>Owner</Table.ColumnHeader>
            <Table.ColumnHeader>Method</Table.ColumnHeader>
            <Table.ColumnHeader>Status</Table.ColumnHeader>
            <Table.ColumnHeader>Progress</Table.ColumnHeader>
            <Table.ColumnHeader>Created</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {scans.map((scan) => {
            const groupName = groupNames.get(scan.groupId);
            return (
              <Table.Row
                key={scan.id}
                cursor="pointer"
                // The name is the link; a click anywhere else on the row goes there too (keyboards use the link).
                onClick={(event) => {
                  if (!(event.target as HTMLElement).closest('a, button')) navigate(paths.scan.getHref(scan.id));
                }}
              >
                <Table.Cell>
                  <Stack gap="1">
                    <AppLink to={paths.scan.getHref(scan.id)} fontWeight="500" color="ink.900">
                      {scan.name}
                    </AppLink>
                    {scan.tags.length > 0 && (
                      <HStack gap="1" wrap="wrap">
                        {scan.tags.map((tag) => (
                          <Badge key={tag} size="xs" variant="outline" colorPalette="gray" fontWeight="400">
                            {tag}
                          </Badge>
                        ))}
                      </HStack>
                    )}
                  </Stack>
                </Table.Cell>
                <Table.Cell>
                  {groupName ? (
                    <AppLink to={paths.group.getHref(scan.groupId)} color="ink.fg">
                      {groupName}
                    </AppLink>
                  ) : (
                    <Text color="fg.muted">Group {scan.groupId}</Text>
                  )}
                </Table.Cell>
                <Table.Cell>{scan.ownerName}</Table.Cell>
                <Table.Cell>
                  <Text fontSize="sm">{methodLabels[scan.method]}</Text>
                </Table.Cell>
                <Table.Cell>
                  <ScanStatusBadge status={scan.status} />
                </Table.Cell>
                <Table.Cell>
                  <ScanProgress scan={scan} />
                </Table.Cell>
                <Table.Cell color="fg.muted" fontSize="sm">
                  <DateTime iso={scan.createdAt} />
                </Table.Cell>
              </Table.Row>
            );
          })}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
