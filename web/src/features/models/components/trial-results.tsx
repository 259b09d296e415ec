import { Alert, SimpleGrid, Stack, Stat, Text } from '@chakra-ui/react';
import type { EvaluateResponse } from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { Plot, PLOT_COLORS } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';

export const FIELD_PLOT_LABEL = 'Trial background: the field φ against e-folds N';
export const EPSILON_PLOT_LABEL = 'Trial background: the Hubble slow-roll parameter ε_H against e-folds N, log scale';

interface TrialResultsProps {
  result: EvaluateResponse & { milliseconds: number };
}

/** What one engine run gave: the observables, how long it took, and the background it integrated. */
export function TrialResults({ result }: TrialResultsProps) {
  if (result.status !== 'ok') {
    return (
      <Alert.Root status="warning" variant="subtle" borderRadius="md" role="alert">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>The engine could not evaluate this point</Alert.Title>
          <Alert.Description>
            {result.message}
            {result.nTotal !== null && ` (${formatNumber(result.nTotal, 4, 'power')} e-folds in total.)`} Change the parameters, φ_init or N_* and run
            it again.
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
    );
  }

  const stats: { label: string; value: string; help: string }[] = [
    { label: 'n_s', value: formatNumber(result.ns, 5, 'power'), help: 'scalar spectral index' },
    { label: 'r', value: formatNumber(result.r, 4, 'power'), help: 'tensor-to-scalar ratio' },
    { label: 'α_s', value: formatNumber(result.alphaS, 3, 'power'), help: 'running of n_s' },
    { label: 'A_s', value: formatNumber(result.As, 4, 'power'), help: 'scalar amplitude of V as given' },
    { label: 'N_total', value: formatNumber(result.nTotal, 4, 'power'), help: 'e-folds from φ_init to the end' },
    { label: 'Amplitude factor', value: formatNumber(result.amplitudeScale, 4, 'power'), help: 'multiply V by this for A_s = 2.1 × 10⁻⁹' },
  ];

  return (
    <Stack gap="5">
      <SimpleGrid as="section" aria-label="Trial results" columns={{ base: 2, md: 3, xl: 6 }} gap="3">
        {stats.map((stat) => (
          <Stat.Root key={stat.label} borderWidth="1px" borderColor="border.muted" borderRadius="md" px="3" py="2.5" bg="bg.panel">
            <Stat.Label fontFamily="mono" color="fg.muted">
              {stat.label}
            </Stat.Label>
            <Stat.ValueText fontFamily="mono" fontSize="xl" color="ink.900" fontWeight="500">
              {stat.value}
            </Stat.ValueText>
            <Stat.HelpText fontSize="xs" color="fg.muted">
              {stat.help}
            </Stat.HelpText>
          </Stat.Root>
        ))}
      </SimpleGrid>
      <Text fontSize="sm" color="fg.muted" role="status">
        Computed in {Math.max(1, Math.round(result.milliseconds))} ms in your browser · φ_init = {formatNumber(result.phiInit, 5, 'power')}, pivot at φ_*
        = {formatNumber(result.phiStar, 5, 'power')}, inflation ends at φ_end = {formatNumber(result.phiEnd, 5, 'power')}
      </Text>
      {result.trajectory && <TrajectoryPlots result={result} />}
    </Stack>
  );
}

function TrajectoryPlots({ result }: TrialResultsProps) {
  const trajectory = result.trajectory!;
  // The pivot crossing, N_* e-folds before the end, marked on both plots.
  const nPivot = result.nTotal !== null && result.nStar !== null ? result.nTotal - result.nStar : undefined;

  const { fieldData, epsilonData } = useMemo(() => {
    const fieldData: Data[] = [
      {
        x: trajectory.N,
        y: trajectory.phi,
        type: 'scatter',
        mode: 'lines',
        name: 'φ(N)',
        line: { color: PLOT_COLORS.ink, width: 2 },
        hovertemplate: 'N = %{x:.3f}<br>φ = %{y:.5g}<extra></extra>',
      },
    ];
    const epsilonData: Data[] = [
      {
        x: trajectory.N,
        y: trajectory.epsilonH,
        type: 'scatter',
        mode: 'lines',
        name: 'ε_H(N)',
        line: { color: PLOT_COLORS.ember, width: 2 },
        hovertemplate: 'N = %{x:.3f}<br>ε_H = %{y:.3g}<extra></extra>',
      },
    ];
    return { fieldData, epsilonData };
  }, [trajectory]);

  const pivotShapes: Layout['shapes'] =
    nPivot === undefined
      ? []
      : [{ type: 'line', xref: 'x', yref: 'paper', x0: nPivot, x1: nPivot, y0: 0, y1: 1, line: { color: PLOT_COLORS.accent, width: 1, dash: 'dot' } }];
  const pivotNote: Layout['annotations'] =
    nPivot === undefined
      ? []
      : [{ x: nPivot, y: 1, xref: 'x', yref: 'paper', text: 'pivot', showarrow: false, yanchor: 'bottom', font: { color: PLOT_COLORS.accent, size: 11 } }];

  const fieldLayout: Partial<Layout> = {
    margin: { l: 64, r: 16, t: 28, b: 52 },
    showlegend: false,
    xaxis: { title: { text: 'N (e-folds from φ_init)' } },
    yaxis: { title: { text: 'φ' } },
    shapes: pivotShapes,
    annotations: pivotNote,
  };
  const epsilonLayout: Partial<Layout> = {
    margin: { l: 64, r: 16, t: 28, b: 52 },
    showlegend: false,
    xaxis: { title: { text: 'N (e-folds from φ_init)' } },
    yaxis: { title: { text: 'ε_H' }, type: 'log', exponentformat: 'power', dtick: 1 },
    shapes: [
      ...(pivotShapes ?? []),
      { type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: 1, y1: 1, line: { color: PLOT_COLORS.muted, width: 1, dash: 'dash' } },
    ],
    annotations: pivotNote,
  };

  return (
    <SimpleGrid columns={{ base: 1, lg: 2 }} gap="4">
      <Plot data={fieldData} layout={fieldLayout} label={FIELD_PLOT_LABEL} height={300} />
      <Plot data={epsilonData} layout={epsilonLayout} label={EPSILON_PLOT_LABEL} height={300} />
    </SimpleGrid>
  );
}
