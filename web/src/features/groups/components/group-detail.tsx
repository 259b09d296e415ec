import { Badge, HStack, Heading, Stack, Table, Text } from '@chakra-ui/react';
import type { GroupDetail as Group } from '@sixtyfold/shared';
import { Panel } from '@/components/ui/panel';
import { RoleBadge } from '@/components/ui/role-badge';

export function GroupDetail({ group }: { group: Group }) {
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
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {group.members.map((member) => (
                  <Table.Row key={member.userId}>
                    <Table.Cell fontWeight="500">{member.displayName}</Table.Cell>
                    <Table.Cell color="fg.muted">{member.email}</Table.Cell>
                    <Table.Cell>
                      <RoleBadge role={member.role} />
                    </Table.Cell>
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
        )}
      </Panel>
    </Stack>
  );
}
