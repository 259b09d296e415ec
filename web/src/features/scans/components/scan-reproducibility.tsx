import { Alert, Button, Field, HStack, Heading, Input, Stack, Table, Text } from '@chakra-ui/react';
import { DEFAULT_REPRODUCTION_SAMPLE, MAX_REPRODUCTION_SAMPLE, type Reproduction } from '@sixtyfold/shared';
import { useState } from 'react';
import { DateTime } from '@/components/ui/date-time';
import { ErrorState } from '@/components/ui/error-state';
import { FailureAlert } from '@/components/ui/failure-alert';
import { formatNumber } from '@/lib/format-number';
import { useCreateReproduction } from '../api/create-reproduction';
import { useReproductions } from '../api/get-reproductions';
import { buildDifference } from '../utils/build-difference';
import { outputLabel } from '../utils/output-labels';

/**
 * "Check reproducibility": recompute a random sample of the scan's OK points on today's engine and
 * compare every output bit for bit. A change of build is said first, before any result.
 */
export function ScanReproducibility({ scanId, canCheck }: { scanId: number; canCheck: boolean }) {
  const checks = useReproductions(scanId);
  const create = useCreateReproduction(scanId);
  const [sampleSize, setSampleSize] = useState(String(DEFAULT_REPRODUCTION_SAMPLE));
  if (checks.isPending) return null;
  if (checks.isError) return <ErrorState title="Could not load the reproducibility checks" error={checks.error} onRetry={() => checks.refetch()} />;
  const { today, scanBuild, items } = checks.data;
  const changed = buildDifference(scanBuild, today);
  const size = Number(sampleSize);
  const sizeProblem = Number.isInteger(size) && size >= 1 && size <= MAX_REPRODUCTION_SAMPLE ? null : `a whole number from 1 to ${MAX_REPRODUCTION_SAMPLE}`;
  const latest = items[0];
  return (
    <Stack gap="3" as="section" aria-labelledby="scan-reproducibility">
      <Heading as="h3" id="scan-reproducibility" size="xs" color="ink.900">
        Reproducibility
      </Heading>
      {changed && (
        <Alert.Root status="warning" variant="subtle" borderRadius="md">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Description>{changed}</Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      {canCheck && (
        <HStack align="end" gap="3" wrap="wrap">
          <Field.Root invalid={sizeProblem !== null} maxW="12rem">
            <Field.Label>Points to recompute</Field.Label>
            <Input type="number" min="1" max={MAX_REPRODUCTION_SAMPLE} step="1" fontFamily="mono" value={sampleSize} onChange={(e) => setSampleSize(e.target.value)} />
            {sizeProblem && <Field.ErrorText>{sizeProblem}</Field.ErrorText>}
          </Field.Root>
          <Button colorPalette="ember" loading={create.isPending} disabled={sizeProblem !== null} onClick={() => create.mutate({ sampleSize: size })}>
            Check reproducibility
          </Button>
        </HStack>
      )}
      {create.isError && <FailureAlert title="Could not start the check">{create.error.message}</FailureAlert>}
      {latest ? <CheckReport check={latest} /> : <Text color="fg.muted">No reproducibility check yet.</Text>}
    </Stack>
  );
}

export function CheckReport({ check }: { check: Reproduction }) {
  const when = <DateTime iso={check.requestedAt} />;
  if (check.status === 'queued' || check.status === 'running') {
    return <Text>Recomputing {check.sampleSize} points ({check.status === 'queued' ? 'waiting for a worker' : 'on a worker'}); asked {when}.</Text>;
  }
  if (check.status === 'failed' || !check.report) return <FailureAlert title="The check failed">{check.error ?? 'no reason recorded'}</FailureAlert>;
  const { report, checkedBuild } = check;
  return (
    <Stack gap="2">
      <Text>
        {report.identical ? `All ${check.sampleSize} recomputed points are identical to the stored ones, bit for bit.` : `Of ${check.sampleSize} recomputed points, some differ from the stored ones.`}{' '}
        Recomputed by <Text as="span" fontFamily="mono">{checkedBuild?.worker ?? 'an unknown worker'}</Text>
        {checkedBuild && ` (engine ${checkedBuild.engineVersion}, node ${checkedBuild.node})`}; asked {when}.
      </Text>
      <Table.Root size="sm" aria-label="Reproducibility by output">
        <Table.Header>
          <Table.Row>
            <Table.ColumnHeader>Output</Table.ColumnHeader>
            <Table.ColumnHeader>Result</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {report.outputs.map((o) => (
            <Table.Row key={o.output}>
              <Table.Cell>{outputLabel(o.output)}</Table.Cell>
              <Table.Cell>
                {o.identical
                  ? 'identical'
                  : `different at ${o.differing} point${o.differing === 1 ? '' : 's'}` +
                    (o.maxRelativeDifference === null ? '' : `: largest relative difference ${formatNumber(o.maxRelativeDifference, 3)}`) +
                    (o.atPointIndex === null ? '' : ` at point ${o.atPointIndex}`)}
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
      {report.statusChanges.length > 0 && (
        <Text color="fg.error">
          Status changed at {report.statusChanges.map((c) => `point ${c.pointIndex} (${c.stored} → ${c.recomputed})`).join(', ')}.
        </Text>
      )}
    </Stack>
  );
}
