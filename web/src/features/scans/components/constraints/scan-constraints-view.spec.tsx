import type { ScanConstraints } from '@sixtyfold/shared';
import { screen, within } from '@testing-library/react';
import { Route, Routes } from 'react-router-dom';
import { json, mockApi } from '@/testing/mock-api';
import { plotIn } from '@/testing/plotly-chart-mock';
import { renderWithProviders } from '@/testing/render';
import { judgedBy, likelihoodSet, naturalSpec, pactSet, scanDetail } from '@/testing/scan-fixtures';
import { ScanConstraintsView } from './scan-constraints-view';

vi.mock('@/components/plots/plotly-chart', () => import('@/testing/plotly-chart-mock'));

const answer = (overrides: Partial<ScanConstraints> = {}): ScanConstraints => ({
  scanId: 42,
  likelihood: judgedBy(likelihoodSet()),
  priors: [{ axis: 'f', prior: 'log' }, { axis: 'nStar', prior: 'uniform' }],
  marginals: [
    { axis: 'f', prior: 'log', values: [5, 7, 10], mass: [0.2, 0.5, 0.3], density: [0.4, 1.2, null] },
    { axis: 'nStar', prior: 'uniform', values: [50, 55, 60], mass: [0.1, 0.3, 0.6], density: [0.02, 0.06, 0.12] },
  ],
  constraints: [
    {
      axis: 'f',
      intervals: [
        { level: 0.68, kind: 'two-sided', lower: 0.02801, upper: 2.2812 },
        { level: 0.95, kind: 'upper-limit', lower: 0.001, upper: 0.86312 },
      ],
      edgeWarning: 'the 95 % region reaches f = 10, the end of the axis: widen it',
    },
    {
      axis: 'nStar',
      intervals: [
        { level: 0.68, kind: 'lower-limit', lower: 58.34, upper: 60 },
        { level: 0.95, kind: 'lower-limit', lower: 54.1, upper: 60 },
      ],
      edgeWarning: null,
    },
  ],
  pair: null,
  bestFit: { pointIndex: 7, deltaChi2: 0, inputs: { f: 7, nStar: 60 } },
  excluded: { count: 2, priorFraction: 0.125 },
  included: 7,
  evidence: { z: 0.2, lnZ: -1.6094, lnZHalf: -1.62, lnZError: 0.011, note: 'The evidence depends on the prior ranges the axes chose.' },
  ...overrides,
});

function renderView(detail = scanDetail(), route = '/scans/42?view=constraints') {
  return renderWithProviders(
    <Routes>
      <Route path="/scans/:scanId" element={<ScanConstraintsView scan={detail} spec={detail.spec} />} />
    </Routes>,
    { route },
  );
}

describe('constraints tab', () => {
  it('shows intervals, limits and the edge warning per axis, the best fit, the left-out points and the evidence', async () => {
    const { requests } = mockApi({
      'GET /api/likelihood-sets': () => json(200, [likelihoodSet(), pactSet]),
      'GET /api/scans/42/constraints': () => json(200, answer()),
    });
    renderView();
    const table = await screen.findByRole('table', { name: 'Parameter constraints' });
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('0.028 – 2.28');
    expect(rows[1]).toHaveTextContent('< 0.863');
    expect(rows[1]).toHaveTextContent('the 95 % region reaches f = 10, the end of the axis: widen it');
    expect(rows[2]).toHaveTextContent('> 58.3');
    expect(rows[2]).toHaveTextContent('> 54.1');
    expect(screen.getByRole('link', { name: 'point 7' })).toHaveAttribute('href', '/scans/42/points/7');
    expect(screen.getByText(/2 failed or flagged points left out \(12.5 % of the prior volume\)/)).toBeInTheDocument();
    expect(screen.getByText(/ln Z = −1.609 ± 0.011/)).toBeInTheDocument();
    expect(screen.getByText(/depends on the prior ranges/)).toBeInTheDocument();
    // The set's statement and sources stand under the picker.
    expect(screen.getByText(/An approximation of the published result/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'arXiv:1807.06211' })).toHaveAttribute('href', 'https://arxiv.org/abs/1807.06211');
    // Planck + BICEP/Keck by default; the priors follow the answer until one is picked.
    expect(requests.find((r) => r.url.pathname.endsWith('/constraints'))?.url.searchParams.get('likelihood')).toBe('planck18-bk18');
    expect(screen.getByRole('combobox', { name: 'Prior on f' })).toHaveValue('log');
    expect(screen.getByRole('link', { name: /Download the 1-D marginals/ })).toHaveAttribute('href', '/api/scans/42/constraints?likelihood=planck18-bk18&format=csv');
  });

  it('draws the 1-D marginal of each axis on the scale of its prior, with the 68 and 95 % regions behind it', async () => {
    mockApi({
      'GET /api/likelihood-sets': () => json(200, [likelihoodSet()]),
      'GET /api/scans/42/constraints': () => json(200, answer()),
    });
    renderView();
    const chart = await screen.findByRole('img', { name: '1-D marginal of f' });
    await vi.waitFor(() => plotIn(chart));
    const plot = plotIn(chart);
    expect(plot.data[0]).toMatchObject({ x: [5, 7, 10], y: [0.4, 1.2, null] });
    expect(plot.layout.xaxis?.type).toBe('log');
    expect(plot.layout.shapes?.map((shape) => [shape.x0, shape.x1])).toEqual([[0.02801, 2.2812], [0.001, 0.86312]]);
    expect(plotIn(screen.getByRole('img', { name: '1-D marginal of N_*' })).layout.xaxis?.type).toBe('linear');
  });

  it('asks with the set and priors in the address', async () => {
    const { requests } = mockApi({
      'GET /api/likelihood-sets': () => json(200, [likelihoodSet(), pactSet]),
      'GET /api/scans/42/constraints': () => json(200, answer({ likelihood: judgedBy(pactSet) })),
    });
    renderView(scanDetail(), '/scans/42?view=constraints&likelihood=pact-lb-bk18@1&prior.f=uniform');
    await screen.findByRole('table', { name: 'Parameter constraints' });
    const asked = requests.find((r) => r.url.pathname.endsWith('/constraints'))!.url.searchParams;
    expect(asked.get('likelihood')).toBe('pact-lb-bk18@1');
    expect(asked.get('prior.f')).toBe('uniform');
    expect(screen.getByRole('combobox', { name: 'Likelihood set' })).toHaveValue('pact-lb-bk18@1');
    expect(screen.getByRole('combobox', { name: 'Prior on f' })).toHaveValue('uniform');
  });

  it('says why a scan over a list of points has none, and asks nothing', () => {
    const { requests } = mockApi({});
    const { axes: _axes, ...listSpec } = naturalSpec;
    renderView(scanDetail({}, { ...listSpec, pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7, 55]] } }));
    expect(screen.getByText(/computes a list of points, not a grid/)).toBeInTheDocument();
    expect(requests).toHaveLength(0);
  });
});
