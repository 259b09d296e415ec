import { Badge } from '@chakra-ui/react';
import type { ScanStatus } from '@sixtyfold/shared';

const look: Record<ScanStatus, { palette: string; variant: 'subtle' | 'solid' | 'outline'; label: string }> = {
  draft: { palette: 'gray', variant: 'outline', label: 'Draft' },
  queued: { palette: 'ink', variant: 'subtle', label: 'Queued' },
  running: { palette: 'ember', variant: 'solid', label: 'Running' },
  completed: { palette: 'green', variant: 'subtle', label: 'Completed' },
  failed: { palette: 'red', variant: 'subtle', label: 'Failed' },
  cancelled: { palette: 'gray', variant: 'subtle', label: 'Cancelled' },
};

export function ScanStatusBadge({ status }: { status: ScanStatus }) {
  const { palette, variant, label } = look[status];
  return (
    <Badge colorPalette={palette} variant={variant} size="sm">
      {label}
    </Badge>
  );
}
