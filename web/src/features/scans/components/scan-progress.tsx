import { HStack, Progress, Stack, Text } from '@chakra-ui/react';
import type { ScanSummary } from '@sixtyfold/shared';

export function ScanProgress({ scan }: { scan: ScanSummary }) {
  const { donePoints, totalPoints, failedPoints } = scan;
  const percent = totalPoints > 0 ? Math.round((donePoints / totalPoints) * 100) : 0;
  return (
    <Stack gap="1" minW="32">
      <Progress.Root value={percent} size="xs" colorPalette={scan.status === 'failed' ? 'red' : 'ember'}>
        {/* The track carries role=progressbar, so it gets the name (Ark would call it just "28%"). */}
        <Progress.Track bg="ink.50" aria-label={`${donePoints} of ${totalPoints} points done`}>
          <Progress.Range />
        </Progress.Track>
      </Progress.Root>
      <HStack gap="2" fontFamily="mono" fontSize="xs">
        <Text color="fg.muted">
          {donePoints.toLocaleString()} / {totalPoints.toLocaleString()}
        </Text>
        {failedPoints > 0 && <Text color="fg.error">{failedPoints.toLocaleString()} failed</Text>}
      </HStack>
    </Stack>
  );
}
