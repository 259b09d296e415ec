import { Table } from '@chakra-ui/react';
import type { OutboxMessageSummary } from '@sixtyfold/shared';
import { AppLink } from '@/components/ui/app-link';
import { DateTime } from '@/components/ui/date-time';
import { paths } from '@/config/paths';

export function OutboxTable({ messages }: { messages: OutboxMessageSummary[] }) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" interactive aria-label="Caught messages">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Received</Table.ColumnHeader>
            <Table.ColumnHeader>To</Table.ColumnHeader>
            <Table.ColumnHeader>Subject</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {messages.map((message) => (
            <Table.Row key={message.id}>
              <Table.Cell fontSize="sm" color="fg.muted">
                <DateTime iso={message.receivedAt} />
              </Table.Cell>
              <Table.Cell color="fg.muted">{message.to.join(', ')}</Table.Cell>
              <Table.Cell fontWeight="500">
                <AppLink to={paths.adminOutboxMessage.getHref(message.id)} color="ink.900">
                  {message.subject || '(no subject)'}
                </AppLink>
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
