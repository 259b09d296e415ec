import { Badge, Table, Text } from '@chakra-ui/react';
import type { ApiToken } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';
import { RemoveButton } from '@/components/ui/remove-button';

interface TokensTableProps {
  tokens: ApiToken[];
  onRevoke: (token: ApiToken) => void;
  /** For tests; expiry is judged against this moment. */
  now?: Date;
}

export function TokensTable({ tokens, onRevoke, now = new Date() }: TokensTableProps) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Name</Table.ColumnHeader>
            <Table.ColumnHeader>Token</Table.ColumnHeader>
            <Table.ColumnHeader>Created</Table.ColumnHeader>
            <Table.ColumnHeader>Last used</Table.ColumnHeader>
            <Table.ColumnHeader>Expires</Table.ColumnHeader>
            <Table.ColumnHeader>Access</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">
              <Text srOnly>Actions</Text>
            </Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {tokens.map((token) => {
            const expired = Date.parse(token.expiresAt) <= now.getTime();
            return (
              <Table.Row key={token.id}>
                <Table.Cell fontWeight="500" color="ink.900">
                  {token.name}
                </Table.Cell>
                <Table.Cell fontFamily="mono" fontSize="sm" color="fg.muted">
                  {token.prefix}…
                </Table.Cell>
                <Table.Cell fontSize="sm" color="fg.muted">
                  <DateTime iso={token.createdAt} />
                </Table.Cell>
                <Table.Cell fontSize="sm" color="fg.muted">
                  {token.lastUsedAt ? <DateTime iso={token.lastUsedAt} /> : <Text as="span">Never</Text>}
                </Table.Cell>
                <Table.Cell fontSize="sm" color="fg.muted">
                  {expired ? (
                    <Badge colorPalette="red" variant="subtle" size="sm" title={token.expiresAt}>
                      Expired
                    </Badge>
                  ) : (
                    <DateTime iso={token.expiresAt} />
                  )}
                </Table.Cell>
                <Table.Cell fontSize="sm" color="fg.muted">
                  {token.readOnly ? (
                    <Badge variant="subtle" size="sm">
                      Read-only
                    </Badge>
                  ) : (
                    <Text as="span">Read and write</Text>
                  )}
                </Table.Cell>
                <Table.Cell textAlign="end">
                  <RemoveButton label={`Revoke ${token.name}`} onClick={() => onRevoke(token)}>
                    Revoke
                  </RemoveButton>
                </Table.Cell>
              </Table.Row>
            );
          })}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
