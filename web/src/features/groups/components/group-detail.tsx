import { Badge, Button, HStack, Heading, NativeSelect, Stack, Table, Text } from '@chakra-ui/react';
import { GROUP_ROLES, type GroupDetail as Group, type GroupMember, type GroupRole } from '@sixtyfold/shared';
import { useState } from 'react';
import { Panel } from '@/components/ui/panel';
import { RemoveButton } from '@/components/ui/remove-button';
import { RoleBadge } from '@/components/ui/role-badge';
import { useChangeMemberRole } from '../api/change-member-role';
import { RemoveMemberDialog } from './remove-member-dialog';

interface GroupDetailProps {
  group: Group;
  /** Leads of the group and site admins manage its members. */
  canManage: boolean;
  /** The signed-in user's id, to offer "Leave group" on their own row. */
  myUserId: number;
  /** Called after I left the group (the page is no longer mine to see). */
  onLeft: () => void;
}

export function GroupDetail({ group, canManage, myUserId, onLeft }: GroupDetailProps) {
  const [removing, setRemoving] = useState<GroupMember | null>(null);
  const changeRole = useChangeMemberRole(group.id);
  return (
    <Stack gap="6">
      <HStack gap="3" wrap="wrap" color="fg.muted" fontSize="sm">
        <Badge variant="outline" colorPalette="gray" fontFamily="mono">
          {group.slug}
        </Badge>
        <Text>
          {group.memberCount} {group.memberCount === 1 ? 'member' : 'members'}
        </Text>
        {group.myRole && (
          <HStack gap="1.5">
            <Text>Your role:</Text>
            <RoleBadge role={group.myRole} />
          </HStack>
        )}
      </HStack>
      <Panel>
        <Heading as="h2" size="sm" px="4" pt="4" pb="3" color="ink.900">
          Members
        </Heading>
        {changeRole.isError && (
          <Text px="4" pb="3" color="fg.error" role="alert">
            Could not change the role: {changeRole.error.message}
          </Text>
        )}
        {group.members.length === 0 ? (
          <Text px="4" pb="4" color="fg.muted">
            This group has no members yet.
          </Text>
        ) : (
          <Table.ScrollArea>
            <Table.Root size="sm">
              <Table.Header>
                <Table.Row bg="bg.subtle">
                  <Table.ColumnHeader>Name</Table.ColumnHeader>
                  <Table.ColumnHeader>E-mail</Table.ColumnHeader>
                  <Table.ColumnHeader>Role</Table.ColumnHeader>
                  <Table.ColumnHeader>
                    <Text srOnly>Actions</Text>
                  </Table.ColumnHeader>
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {group.members.map((member) => {
                  const isMe = member.userId === myUserId;
                  return (
                    <Table.Row key={member.userId}>
                      <Table.Cell fontWeight="500">
                        {member.displayName}
                        {isMe && (
                          <Text as="span" color="fg.muted" fontWeight="400">
                            {' '}
                            (you)
                          </Text>
                        )}
                      </Table.Cell>
                      <Table.Cell color="fg.muted">{member.email}</Table.Cell>
                      <Table.Cell>
                        {canManage ? (
                          <NativeSelect.Root size="xs" w="28" disabled={changeRole.isPending}>
                            <NativeSelect.Field
                              aria-label={`Role of ${member.displayName}`}
                              value={member.role}
                              onChange={(event) => changeRole.mutate({ userId: member.userId, role: event.target.value as GroupRole })}
                            >
                              {GROUP_ROLES.map((role) => (
                                <option key={role} value={role}>
                                  {role}
                                </option>
                              ))}
                            </NativeSelect.Field>
                            <NativeSelect.Indicator />
                          </NativeSelect.Root>
                        ) : (
                          <RoleBadge role={member.role} />
                        )}
                      </Table.Cell>
                      <Table.Cell textAlign="end">
                        {isMe ? (
                          <Button size="xs" variant="outline" onClick={() => setRemoving(member)}>
                            Leave group
                          </Button>
                        ) : (
                          canManage && (
                            <RemoveButton label={`Remove ${member.displayName}`} onClick={() => setRemoving(member)}>
                              Remove
                            </RemoveButton>
                          )
                        )}
                      </Table.Cell>
                    </Table.Row>
                  );
                })}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
        )}
      </Panel>
      <RemoveMemberDialog
        groupId={group.id}
        groupName={group.name}
        member={removing}
        isMe={removing?.userId === myUserId}
        onClose={() => setRemoving(null)}
        onRemoved={(userId) => {
          setRemoving(null);
          if (userId === myUserId) onLeft();
        }}
      />
    </Stack>
  );
}
