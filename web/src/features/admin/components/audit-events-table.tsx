import { Badge, Table, Text } from '@chakra-ui/react';
import type { AuditEvent } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';

function detailsText(details: AuditEvent['details']): string {
  const entries = Object.entries(details);
  if (entries.length === 0) return '—';
  return entries.map(([key, value]) => `${key}=${typeof value === 'string' ? value : JSON.stringify(value)}`).join('  ');
}

export function AuditEventsTable({ events }: { events: AuditEvent[] }) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>When</Table.ColumnHeader>
            <Table.ColumnHeader>Action</Table.ColumnHeader>
            <Table.ColumnHeader>Actor</Table.ColumnHeader>
            <Table.ColumnHeader>Target</Table.ColumnHeader>
            <Table.ColumnHeader>Details</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {events.map((event) => (
            <Table.Row key={event.id}>
              <Table.Cell fontSize="sm" color="fg.muted">
                <DateTime iso={event.createdAt} />
              </Table.Cell>
              <Table.Cell>
                <Badge variant="subtle" colorPalette="ink" fontFamily="mono" size="sm">
                  {event.action}
                </Badge>
              </Table.Cell>
              <Table.Cell fontSize="sm">{event.actorEmail ?? <Text as="span" color="fg.muted">system</Text>}</Table.Cell>
              <Table.Cell fontSize="sm" fontFamily="mono" color="fg.muted" whiteSpace="nowrap">
                {event.targetType ? `${event.targetType}${event.targetId ? ` #${event.targetId}` : ''}` : '—'}
                {event.groupId !== null && ` · group ${event.groupId}`}
              </Table.Cell>
              <Table.Cell fontSize="xs" fontFamily="mono" color="fg.muted" maxW="md" truncate title={JSON.stringify(event.details)}>
                {detailsText(event.details)}
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
