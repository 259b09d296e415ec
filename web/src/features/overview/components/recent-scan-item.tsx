import { HStack, Stack, Text } from '@chakra-ui/react';
import type { ScanSummary } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { AppLink } from '@/components/ui/app-link';
import { DateTime } from '@/components/ui/date-time';
import { paths } from '@/config/paths';

interface RecentScanItemProps {
  scan: ScanSummary;
  groupName: string | undefined;
  /** The scan's status badge, drawn by the scans feature. */
  badge: ReactNode;
}

/** One finished scan in the overview's list: what, where, how it ended and when. */
export function RecentScanItem({ scan, groupName, badge }: RecentScanItemProps) {
  return (
    <Stack as="li" direction={{ base: 'column', sm: 'row' }} justify="space-between" gap={{ base: '1.5', sm: '4' }} px="4" py="3">
      <Stack gap="0.5" minW="0">
        <AppLink to={paths.scan.getHref(scan.id)} fontWeight="500" color="ink.900" wordBreak="break-word">
          {scan.name}
        </AppLink>
        <Text fontSize="xs" color="fg.muted">
          {groupName ?? `Group ${scan.groupId}`} · {scan.donePoints.toLocaleString('en-US')} of {scan.totalPoints.toLocaleString('en-US')} points
          {scan.failedPoints > 0 && `, ${scan.failedPoints.toLocaleString('en-US')} failed`}
        </Text>
      </Stack>
      <HStack gap="3" flexShrink="0">
        {badge}
        <Text fontSize="sm" color="fg.muted">
          <DateTime iso={scan.finishedAt} />
        </Text>
      </HStack>
    </Stack>
  );
}
