import { Alert, Heading, Stack, Text } from '@chakra-ui/react';
import { DEFAULT_POINT_LIMIT, pointLimitProblem } from '@sixtyfold/shared';
import { formatDuration } from '@/lib/format-duration';
import { formatNumber } from '@/lib/format-number';
import type { RunEstimate } from './use-run-estimate';

export type WorkerSlots = number | 'loading' | 'unavailable';

interface LaunchSummaryProps {
  /** Points of the grid, or null while an axis is incomplete. */
  points: number | null;
  estimate: RunEstimate;
  /** Total concurrency of the live workers, or why it is not known. */
  workerSlots: WorkerSlots;
}

const ms = (value: number) => `${formatNumber(value, 2)} ms`;

export function LaunchSummary({ points, estimate, workerSlots }: LaunchSummaryProps) {
  const tooLarge = points === null ? null : pointLimitProblem(points, DEFAULT_POINT_LIMIT, "the site's usual");
  return (
    <Stack as="section" aria-labelledby="launch-summary" gap="3" p="4" bg="ink.subtle" borderRadius="lg" borderWidth="1px" borderColor="ink.muted">
      <Heading as="h2" size="sm" id="launch-summary" color="ink.900">
        Before you launch
      </Heading>
      <Text fontSize="lg" fontWeight="600" color="ink.900" aria-live="polite">
        {points === null ? 'Complete the axes to count the points.' : `${points.toLocaleString('en-US')} ${points === 1 ? 'point' : 'points'}`}
      </Text>
      {tooLarge && (
        <Text color="fg.error" fontSize="sm">
          {tooLarge}. Your group may allow less; the server checks when you launch.
        </Text>
      )}
      <Stack gap="1" aria-live="polite" fontSize="sm">
        <EstimateText points={points} estimate={estimate} workerSlots={workerSlots} />
      </Stack>
    </Stack>
  );
}

function EstimateText({ points, estimate, workerSlots }: LaunchSummaryProps) {
  if (estimate.status === 'idle' || points === null) {
    return <Text color="fg.muted">The run time is estimated once every field is valid.</Text>;
  }
  if (estimate.status === 'timing') return <Text color="fg.muted">Timing a few points of this grid in your browser…</Text>;
  if (estimate.status === 'failed') return <Text color="fg.error">Could not time points in this browser: {estimate.message}</Text>;

  const oneSlotSeconds = (estimate.msPerPoint * points) / 1000;
  const method = `Timed from ${estimate.sampled} points of this grid in your browser (${ms(estimate.msPerPoint)} each)`;
  return (
    <>
      {typeof workerSlots === 'string' ? (
        <>
          <Text fontWeight="500">Estimated run time: {formatDuration(oneSlotSeconds)} on one worker slot.</Text>
          <Text color="fg.muted">
            {method}.{' '}
            {workerSlots === 'loading' ? 'Reading the worker pool to share this among its slots…' : 'The worker pool could not be read, so this assumes a single slot.'}{' '}
            The workers' speed may differ.
          </Text>
        </>
      ) : workerSlots === 0 ? (
        <Alert.Root status="warning" variant="subtle" borderRadius="md">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>No worker is alive</Alert.Title>
            <Alert.Description>
              The scan will wait in the queue until a worker starts. At your browser's speed ({ms(estimate.msPerPoint)} a point) one
              worker slot would need {formatDuration(oneSlotSeconds)}.
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      ) : (
        <>
          <Text fontWeight="500">
            Estimated run time: {formatDuration(oneSlotSeconds / workerSlots)} on the {workerSlots} worker{' '}
            {workerSlots === 1 ? 'slot' : 'slots'} alive now.
          </Text>
          <Text color="fg.muted">
            {method}, times {points.toLocaleString('en-US')} points, shared among {workerSlots}{' '}
            {workerSlots === 1 ? 'slot' : 'slots'}. The workers' machines may be faster or slower, and other scans share them.
          </Text>
        </>
      )}
      {estimate.failed > 0 && (
        <Text color="fg.warning">
          {estimate.failed} of the {estimate.sampled} sample points failed ({estimate.firstFailure}); the scan records such points as
          failed.
        </Text>
      )}
    </>
  );
}
