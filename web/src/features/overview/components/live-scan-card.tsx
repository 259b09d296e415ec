import { chakra, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import type { ScanSummary } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { AppLink } from '@/components/ui/app-link';
import { DateTime } from '@/components/ui/date-time';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { formatDuration, formatRate } from '@/lib/format-duration';
import type { ScanPace } from '@/lib/scan-pace';

interface LiveScanCardProps {
  scan: ScanSummary;
  groupName: string | undefined;
  /** For a running scan: its pace, or undefined while its details load. Queued scans have none. */
  pace?: ScanPace;
  /** The scan's status badge and progress bar, drawn by the scans feature. */
  badge: ReactNode;
  children: ReactNode;
}

export function LiveScanCard({ scan, groupName, pace, badge, children }: LiveScanCardProps) {
  const headingId = `live-scan-${scan.id}`;
  return (
    <Panel as="article" aria-labelledby={headingId}>
      <Stack gap="3" p="4">
        <HStack justify="space-between" align="start" gap="3">
          <Stack gap="0.5" minW="0">
            <Heading as="h3" size="sm" id={headingId} fontWeight="600">
              <AppLink to={paths.scan.getHref(scan.id)} color="ink.900" wordBreak="break-word">
                {scan.name}
              </AppLink>
            </Heading>
            <Text fontSize="xs" color="fg.muted">
              {groupName ?? `Group ${scan.groupId}`} · {scan.ownerName}
            </Text>
          </Stack>
          {badge}
        </HStack>
        {children}
        {scan.status === 'running' ? (
          <SimpleGrid as="dl" columns={2} gap="2" fontSize="sm">
            <Fact label="Rate">{pace?.pointsPerSecond ? formatRate(pace.pointsPerSecond) : 'measuring…'}</Fact>
            <Fact label="Time left">
              {pace?.remainingSeconds === 0 ? 'finishing' : pace?.remainingSeconds != null ? formatDuration(pace.remainingSeconds) : 'not known yet'}
            </Fact>
          </SimpleGrid>
        ) : (
          <Text fontSize="sm" color="fg.muted">
            Waiting for a free worker slot, queued <DateTime iso={scan.createdAt} />.
          </Text>
        )}
      </Stack>
    </Panel>
  );
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <Stack gap="0">
      <chakra.dt fontSize="xs" color="fg.muted">
        {label}
      </chakra.dt>
      <chakra.dd fontFamily="mono" color="ink.900">
        {children}
      </chakra.dd>
    </Stack>
  );
}
