import { Progress, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import type { ScanDetail } from '@sixtyfold/shared';
import { formatDuration, formatRate } from '@/lib/format-duration';
import { scanPace } from '@/lib/scan-pace';
import { isLive, LIVE_REFRESH_MS } from '../api/get-scan';

function Figure({ label, value, tone }: { label: string; value: string; tone?: string }) {
  return (
    <Stack gap="0.5">
      <Text fontSize="xs" color="fg.muted" textTransform="uppercase" letterSpacing="0.04em">
        {label}
      </Text>
      <Text fontFamily="mono" fontSize="md" color={tone ?? 'ink.900'}>
        {value}
      </Text>
    </Stack>
  );
}

/** Counts, rate and time left; the page polls the scan while it is live, so these move. */
export function ScanLiveProgress({ scan }: { scan: ScanDetail }) {
  const { total, done, failed, running, queued, elapsedSeconds, remainingSeconds } = scan.progress;
  const finished = done + failed;
  const rate = scanPace(scan.progress).pointsPerSecond;
  const percent = total > 0 ? (finished / total) * 100 : 0;
  const live = isLive(scan);
  const n = (value: number) => value.toLocaleString('en-US');

  let timeLabel = 'Took';
  let timeValue = elapsedSeconds === null ? '—' : formatDuration(elapsedSeconds);
  if (live) {
    timeLabel = 'Time left';
    timeValue = remainingSeconds === null ? (scan.status === 'queued' ? 'waiting for a worker' : 'estimating…') : formatDuration(remainingSeconds);
  }

  return (
    <Stack gap="3">
      <Progress.Root
        value={percent}
        size="sm"
        colorPalette={scan.status === 'failed' ? 'red' : 'ember'}
        // The progress bar names itself by its value; this says it in points.
        translations={{ value: () => `${n(finished)} of ${n(total)} points computed` }}
      >
        <Progress.Track bg="ink.50">
          <Progress.Range />
        </Progress.Track>
      </Progress.Root>
      <SimpleGrid columns={{ base: 2, sm: 3, lg: 6 }} gap="3">
        <Figure label="Done" value={n(done)} />
        <Figure label="Failed" value={n(failed)} tone={failed > 0 ? 'fg.error' : undefined} />
        <Figure label="Total" value={n(total)} />
        <Figure label="Rate" value={rate === null ? '—' : formatRate(rate)} />
        <Figure label={timeLabel} value={timeValue} />
        {live ? <Figure label="Running · queued" value={`${n(running)} · ${n(queued)}`} /> : <Figure label="Computed" value={`${Math.round(percent)}%`} />}
      </SimpleGrid>
      {live && (
        <Text fontSize="xs" color="fg.muted">
          Refreshing every {LIVE_REFRESH_MS / 1000} s while the scan is {scan.status}.
        </Text>
      )}
    </Stack>
  );
}
