import { Badge, Table, Text } from '@chakra-ui/react';
import type { AdminUser } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';

export function UsersTable({ users }: { users: AdminUser[] }) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" interactive>
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Name</Table.ColumnHeader>
            <Table.ColumnHeader>E-mail</Table.ColumnHeader>
            <Table.ColumnHeader>Site role</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Groups</Table.ColumnHeader>
            <Table.ColumnHeader>Last sign-in</Table.ColumnHeader>
            <Table.ColumnHeader>Joined</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {users.map((user) => (
            <Table.Row key={user.id}>
              <Table.Cell fontWeight="500" color="ink.900">
                {user.displayName}
              </Table.Cell>
              <Table.Cell color="fg.muted">{user.email}</Table.Cell>
              <Table.Cell>
                {user.siteRole === 'admin' ? (
                  <Badge colorPalette="ember" variant="solid" size="sm">
                    Admin
                  </Badge>
                ) : (
                  <Badge colorPalette="gray" variant="subtle" size="sm">
                    User
                  </Badge>
                )}
              </Table.Cell>
              <Table.Cell textAlign="end" fontFamily="mono">
                {user.groupCount}
              </Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted">
                {user.lastLoginAt ? <DateTime iso={user.lastLoginAt} /> : <Text as="span">Never</Text>}
              </Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted">
                <DateTime iso={user.createdAt} />
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
