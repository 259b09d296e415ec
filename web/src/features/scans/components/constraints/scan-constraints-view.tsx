import { Badge, Box, Button, HStack, Link, Stack, Table, Text } from '@chakra-ui/react';
import type { ScanConstraints, ScanDetail, StoredScanSpec } from '@sixtyfold/shared';
import { Link as RouterLink } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { SelectField } from '@/components/ui/select-field';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format-number';
import { DEFAULT_LIKELIHOOD } from '../../api/get-likelihood-sets';
import { constraintsCsvHref, useScanConstraints, type ConstraintsQuery } from '../../api/get-scan-constraints';
import { useChosenLikelihoods } from '../../hooks/use-chosen-likelihoods';
import { useViewParams } from '../../hooks/use-view-params';
import { formatInterval } from '../../utils/format-interval';
import { inputLabel } from '@/lib/point-labels';
import { LikelihoodSetNote } from '../likelihood-set-note';
import { LikelihoodSetSelect } from '../likelihood-set-picker';
import { MarginalPlots } from './marginal-plots';

const PRIOR_OPTIONS = [
  { value: 'uniform', label: 'Uniform' },
  { value: 'log', label: 'Uniform in the logarithm' },
];

const isPrior = (value: string | null): value is 'uniform' | 'log' => value === 'uniform' || value === 'log';

/**
 * What a grid scan's data allow under one likelihood set: 68 and 95 % intervals per axis, the best
 * fit and the evidence. The set and any prior picked by hand live in the address
 * (`likelihood`, `prior.<axis>`); the API picks the other priors from the axes and says which.
 */
export function ScanConstraintsView({ scan, spec }: { scan: ScanDetail; spec: StoredScanSpec }) {
  if (!spec.axes) {
    return (
      <Text color="fg.muted" py="4">
        This scan computes a list of points, not a grid: there is no prior volume to integrate over, so it has no parameter
        constraints or evidence. Its points are judged one by one on the n_s–r plane and in the points table.
      </Text>
    );
  }
  return <GridConstraints scan={scan} axes={spec.axes.map((axis) => axis.parameter)} />;
}

function GridConstraints({ scan, axes }: { scan: ScanDetail; axes: string[] }) {
  const [params, update] = useViewParams();
  const choice = useChosenLikelihoods([DEFAULT_LIKELIHOOD]);
  const priors = Object.fromEntries(axes.flatMap((axis) => { const prior = params.get(`prior.${axis}`); return isPrior(prior) ? [[axis, prior]] : []; }));
  const query: ConstraintsQuery = { likelihood: choice.refs[0], priors };
  const constraints = useScanConstraints(scan.id, query);
  const answer = constraints.data;

  const priorOf = (axis: string) => priors[axis] ?? answer?.priors.find((p) => p.axis === axis)?.prior ?? 'uniform';

  return (
    <Stack gap="4" py="2">
      <Panel p={{ base: '3', md: '4' }}>
        <HStack gap="3" wrap="wrap" align="end">
          <LikelihoodSetSelect choice={choice} value={answer ? answer.likelihood.ref : query.likelihood} />
          {axes.map((axis) => (
            <SelectField
              key={axis}
              label={`Prior on ${inputLabel(axis)}`}
              value={priorOf(axis)}
              options={PRIOR_OPTIONS}
              onChange={(next) => update({ [`prior.${axis}`]: next })}
            />
          ))}
        </HStack>
        {answer && (
          <Box mt="3" fontSize="sm">
            <LikelihoodSetNote likelihood={answer.likelihood} />
          </Box>
        )}
      </Panel>
      {constraints.isError ? (
        <ErrorState title="Could not compute the constraints" error={constraints.error} onRetry={() => constraints.refetch()} />
      ) : !answer ? (
        <LoadingState label="Computing the constraints…" />
      ) : (
        <ConstraintsResult scanId={scan.id} answer={answer} csvHref={constraintsCsvHref(scan.id, query)} />
      )}
    </Stack>
  );
}

function ConstraintsResult({ scanId, answer, csvHref }: { scanId: number; answer: ScanConstraints; csvHref: string }) {
  const at = (axis: string, level: number) => answer.constraints.find((c) => c.axis === axis)?.intervals.find((i) => i.level === level);
  const { bestFit, excluded, evidence } = answer;
  return (
    <Stack gap="4">
      <Panel>
        <Table.ScrollArea>
          <Table.Root size="sm" aria-label="Parameter constraints">
            <Table.Header>
              <Table.Row bg="bg.subtle">
                <Table.ColumnHeader>Parameter</Table.ColumnHeader>
                <Table.ColumnHeader>Prior</Table.ColumnHeader>
                <Table.ColumnHeader>68 %</Table.ColumnHeader>
                <Table.ColumnHeader>95 %</Table.ColumnHeader>
              </Table.Row>
            </Table.Header>
            <Table.Body>
              {answer.constraints.map((constraint) => {
                const one = at(constraint.axis, 0.68);
                const two = at(constraint.axis, 0.95);
                return (
                  <Table.Row key={constraint.axis}>
                    <Table.Cell>
                      <Text as="span" fontWeight="600">
                        {inputLabel(constraint.axis)}
                      </Text>
                      {constraint.edgeWarning && (
                        <Badge ms="2" colorPalette="orange" variant="subtle" whiteSpace="normal">
                          {constraint.edgeWarning}
                        </Badge>
                      )}
                    </Table.Cell>
                    <Table.Cell color="fg.muted">{answer.priors.find((p) => p.axis === constraint.axis)?.prior === 'log' ? 'log' : 'uniform'}</Table.Cell>
                    <Table.Cell fontFamily="mono">{one ? formatInterval(one) : '—'}</Table.Cell>
                    <Table.Cell fontFamily="mono">{two ? formatInterval(two) : '—'}</Table.Cell>
                  </Table.Row>
                );
              })}
            </Table.Body>
          </Table.Root>
        </Table.ScrollArea>
      </Panel>
      <MarginalPlots answer={answer} />
      <Panel p={{ base: '3', md: '4' }}>
        <Stack gap="2" fontSize="sm">
          {bestFit ? (
            <Text>
              Best fit:{' '}
              <Link asChild>
                <RouterLink to={paths.point.getHref(scanId, bestFit.pointIndex)}>point {bestFit.pointIndex}</RouterLink>
              </Link>{' '}
              at {Object.entries(bestFit.inputs).map(([name, value]) => `${inputLabel(name)} = ${formatNumber(value, 4, 'power')}`).join(', ')}, Δχ² ={' '}
              {formatNumber(bestFit.deltaChi2, 3, 'power')}
            </Text>
          ) : (
            <Text>No point of the scan could be judged, so there is no best fit.</Text>
          )}
          <Text>
            {excluded.count} failed or flagged {excluded.count === 1 ? 'point' : 'points'} left out ({formatNumber(excluded.priorFraction * 100, 3, 'power')} % of the
            prior volume); {answer.included} judged.
          </Text>
          {evidence && (
            <Text>
              ln Z = {formatNumber(evidence.lnZ, 4, 'power')} ± {formatNumber(evidence.lnZError, 2, 'power')}.{' '}
              <Text as="span" color="fg.muted">
                {evidence.note}
              </Text>
            </Text>
          )}
          <HStack>
            <Button asChild size="sm" variant="outline">
              <a href={csvHref} download>
                Download the 1-D marginals (CSV)
              </a>
            </Button>
          </HStack>
        </Stack>
      </Panel>
    </Stack>
  );
}
