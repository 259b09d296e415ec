import { Badge } from '@chakra-ui/react';
import type { GroupRole } from '@sixtyfold/shared';

const palette: Record<GroupRole, string> = { lead: 'ember', member: 'ink', viewer: 'gray' };

export function RoleBadge({ role }: { role: GroupRole }) {
  return (
    <Badge colorPalette={palette[role]} variant="subtle" textTransform="capitalize" size="sm">
      {role}
    </Badge>
  );
}
