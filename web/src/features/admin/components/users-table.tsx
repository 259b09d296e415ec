import { Badge, Button, Table, Text } from '@chakra-ui/react';
import type { AdminUser } from '@sixtyfold/shared';
import { DateTime } from '@/components/ui/date-time';
import { RemoveButton } from '@/components/ui/remove-button';

interface UsersTableProps {
  users: AdminUser[];
  /** The signed-in admin, who cannot disable their own account. */
  currentUserId: number | undefined;
  onDisable: (user: AdminUser) => void;
  onEnable: (user: AdminUser) => void;
  /** The account being re-enabled right now, if any. */
  enablingId?: number | null;
}

export function UsersTable({ users, currentUserId, onDisable, onEnable, enablingId = null }: UsersTableProps) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" interactive>
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Name</Table.ColumnHeader>
            <Table.ColumnHeader>E-mail</Table.ColumnHeader>
            <Table.ColumnHeader>Site role</Table.ColumnHeader>
            <Table.ColumnHeader>State</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Groups</Table.ColumnHeader>
            <Table.ColumnHeader>Last sign-in</Table.ColumnHeader>
            <Table.ColumnHeader>Joined</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">
              <Text srOnly>Actions</Text>
            </Table.ColumnHeader>
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
              <Table.Cell>
                {user.disabledAt ? (
                  <Badge colorPalette="red" variant="subtle" size="sm" title={`Disabled ${user.disabledAt}`}>
                    Disabled
                  </Badge>
                ) : (
                  <Badge colorPalette="green" variant="subtle" size="sm">
                    Active
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
              <Table.Cell textAlign="end">
                {user.disabledAt ? (
                  <Button
                    size="xs"
                    variant="ghost"
                    colorPalette="ink"
                    aria-label={`Enable ${user.displayName}`}
                    loading={enablingId === user.id}
                    loadingText="Enabling…"
                    onClick={() => onEnable(user)}
                  >
                    Enable
                  </Button>
                ) : user.id === currentUserId ? null : (
                  <RemoveButton label={`Disable ${user.displayName}`} onClick={() => onDisable(user)}>
                    Disable
                  </RemoveButton>
                )}
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
