import { Alert, Badge, Button, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import { pointRequest, scanPoints, type ScanDetail, type StoredScanSpec } from '@sixtyfold/shared';
import { useMemo, useState, type ReactNode } from 'react';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { ApiRequestError } from '@/lib/api-client';
import { isLive } from '../../api/get-scan';
import { useScanPoint } from '../../api/get-scan-point';
import { usePointEngine } from '../../hooks/use-point-engine';
import { PointInputs } from './point-inputs';
import { PointOutputs } from './point-outputs';
import { PointSpectrum } from './point-spectrum';
import { PointTrajectory } from './point-trajectory';
import { SlowRollCheck } from './slow-roll-check';

function Section({ id, title, children, aside }: { id: string; title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <Panel as="section" aria-labelledby={id} p={{ base: '4', md: '5' }}>
      <HStack justify="space-between" align="start" gap="3" wrap="wrap" mb="3">
        <Heading as="h2" id={id} size="md" color="ink.900">
          {title}
        </Heading>
        {aside}
      </HStack>
      {children}
    </Panel>
  );
}

function EngineProblem({ status, message }: { status: string; message: string }) {
  return (
    <Alert.Root status="warning" variant="subtle" borderRadius="md">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title fontFamily="mono">{status}</Alert.Title>
        <Alert.Description>{message}</Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}

const ms = (value: number) => `${value < 10 ? value.toFixed(1) : Math.round(value).toLocaleString('en-US')} ms`;

interface ScanPointViewProps {
  scan: ScanDetail;
  spec: StoredScanSpec;
  pointIndex: number;
}

/**
 * One point: its inputs, what the workers stored, and the same point evaluated again here in the
 * browser with its trajectory (and, for the exact method, its spectrum on request).
 */
export function ScanPointView({ scan, spec, pointIndex }: ScanPointViewProps) {
  const points = useMemo(() => scanPoints(spec), [spec]);
  const request = useMemo(() => pointRequest(spec, spec.potentialSource, points.point(pointIndex)), [spec, points, pointIndex]);
  const stored = useScanPoint(scan.id, pointIndex, { live: isLive(scan) });
  const trajectory = usePointEngine(scan.id, pointIndex, request, 'trajectory');
  const [spectrumWanted, setSpectrumWanted] = useState(false);
  const spectrum = usePointEngine(scan.id, pointIndex, request, 'spectrum', spectrumWanted);
  const [modesWanted, setModesWanted] = useState(false);
  const modes = usePointEngine(scan.id, pointIndex, request, 'modes', modesWanted);

  // A 404 for a point inside the grid means the workers have not stored it yet.
  const notStored = stored.error instanceof ApiRequestError && stored.error.status === 404;
  const point = stored.data ?? null;
  const fresh = trajectory.data;

  return (
    <Stack gap="5">
      <Section id="point-inputs" title="Inputs">
        <PointInputs spec={spec} points={points} pointIndex={pointIndex} phiInitUsed={fresh?.phiInit} />
      </Section>

      <Section
        id="point-outputs"
        title="Outputs"
        aside={
          point && (
            <Badge colorPalette={point.status === 'ok' ? 'green' : 'red'} variant="subtle" fontFamily="mono">
              {point.status}
            </Badge>
          )
        }
      >
        <Stack gap="3">
          {stored.isPending ? (
            <LoadingState label="Loading the stored point…" />
          ) : notStored ? (
            <Text color="fg.muted">
              The workers have not stored this point yet.{' '}
              {isLive(scan) ? 'This page asks again every few seconds while the scan runs.' : 'The scan stopped before computing it.'} The
              values below are recomputed here without it.
            </Text>
          ) : stored.isError ? (
            <ErrorState title="Could not load the stored point" error={stored.error} onRetry={() => stored.refetch()} />
          ) : null}
          {point?.failureReason && <EngineProblem status={point.status} message={point.failureReason} />}
          <Text fontSize="sm" color="fg.muted">
            The same engine code runs in your browser as on the workers. Where this browser rounds elementary functions (exp, pow, …)
            exactly as the workers’ Node does, every value is identical; otherwise values differ by rounding only, shown with the
            relative difference.
            {trajectory.isFetching && ' Computing…'}
            {fresh && ` Recomputed in ${ms(fresh.milliseconds)}.`}
          </Text>
          {trajectory.isError && (
            <ErrorState title="The in-browser engine could not evaluate the point" error={trajectory.error} onRetry={() => trajectory.refetch()} />
          )}
          <PointOutputs stored={point} recomputed={fresh} />
        </Stack>
      </Section>

      <Section id="point-trajectory" title="Trajectory">
        {trajectory.isPending ? (
          <LoadingState label="Computing the trajectory in your browser…" />
        ) : trajectory.isError ? (
          <Text color="fg.muted">No trajectory: the evaluation failed (see above).</Text>
        ) : trajectory.data.trajectory ? (
          <Stack gap="3">
            {trajectory.data.status !== 'ok' && (
              <EngineProblem status={trajectory.data.status} message={trajectory.data.message} />
            )}
            <PointTrajectory trajectory={trajectory.data.trajectory} nTotal={trajectory.data.nTotal} nStar={trajectory.data.nStar} />
          </Stack>
        ) : (
          <Stack gap="2">
            <EngineProblem status={trajectory.data.status} message={trajectory.data.message} />
            <Text fontSize="sm" color="fg.muted">
              The engine stopped before it had a background to draw.
            </Text>
          </Stack>
        )}
      </Section>

      {spec.method === 'slowroll' && (
        <Section
          id="point-slow-roll-check"
          title="How exact is slow roll here"
          aside={
            !modesWanted && (
              <Button size="sm" colorPalette="ember" onClick={() => setModesWanted(true)}>
                Compare with the mode equations
              </Button>
            )
          }
        >
          {!modesWanted ? (
            <Text color="fg.muted">
              This scan uses first-order slow roll, which is only refused outside its regime. Inside it, it can still be off by more than
              the data’s error bars: compare this point with the exact mode equations, computed in your browser.
            </Text>
          ) : modes.isPending || trajectory.isPending ? (
            <LoadingState label="Solving the mode equations in your browser…" />
          ) : modes.isError ? (
            <ErrorState title="The in-browser engine could not solve the mode equations" error={modes.error} onRetry={() => modes.refetch()} />
          ) : trajectory.data ? (
            <SlowRollCheck slowRoll={trajectory.data} modes={modes.data} />
          ) : null}
        </Section>
      )}

      {spec.method === 'exact' && (
        <Section
          id="point-spectrum"
          title="Spectrum near the pivot"
          aside={
            !spectrumWanted && (
              <Button size="sm" colorPalette="ember" onClick={() => setSpectrumWanted(true)}>
                Compute the spectrum
              </Button>
            )
          }
        >
          {!spectrumWanted ? (
            <Text color="fg.muted">
              P_R(k) and P_t(k) from the mode equations at scales around the pivot k_* = 0.05 Mpc⁻¹, computed in your browser. It
              solves one mode equation per scale, so it takes longer than the point itself.
            </Text>
          ) : spectrum.isPending ? (
            <LoadingState label="Solving the mode equations in your browser…" />
          ) : spectrum.isError ? (
            <ErrorState title="The in-browser engine could not compute the spectrum" error={spectrum.error} onRetry={() => spectrum.refetch()} />
          ) : spectrum.data.spectrum ? (
            <Stack gap="2">
              <PointSpectrum spectrum={spectrum.data.spectrum} />
              <Text fontSize="xs" color="fg.muted">
                Computed in {ms(spectrum.data.milliseconds)}.
              </Text>
            </Stack>
          ) : (
            <EngineProblem status={spectrum.data.status} message={spectrum.data.message} />
          )}
        </Section>
      )}
    </Stack>
  );
}
