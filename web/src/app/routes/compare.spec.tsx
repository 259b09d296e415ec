import type { ConstraintRegion, ScanGridSlice } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { adminUser, scan } from '@/testing/fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { plotIn } from '@/testing/plotly-chart-mock';
import { renderApp } from '@/testing/render';
import { judgedBy, likelihoodSet, naturalSpec, pactSet, scanDetail, slice } from '@/testing/scan-fixtures';

vi.mock('@/components/plots/plotly-chart', () => import('@/testing/plotly-chart-mock'));
// A whole page with a dozen queries: give a busy machine time.
vi.setConfig({ testTimeout: 20_000 });
const slow = { timeout: 5_000 };

const secondSpec = { ...naturalSpec, groupId: 11, name: 'Natural inflation, second look' };
const details = { 42: scanDetail({ id: 42 }), 43: scanDetail({ id: 43, groupId: 11, name: secondSpec.name }, secondSpec) };

const status = [['ok', 'ok', 'ok'], ['ok', 'ok', 'ok'], ['ok', 'ok', 'ok']];
const axes = { x: { parameter: 'f', values: [5, 7, 10] }, y: { parameter: 'nStar', values: [50, 55, 60] } };
const slices: Record<string, ScanGridSlice> = {
  ns: slice('ns', [[0.955, 0.958, 0.96], [0.961, 0.9649, 0.966], [0.966, 0.967, 0.968]], status, axes),
  r: slice('r', [[0.09, 0.05, 0.04], [0.08, 0.03, 0.02], [0.07, 0.02, 0.01]], status, axes),
};
/** Δχ² per cell as the API would give it, a different map per set, so the lines can be told apart. */
const chi2Of: Record<string, ScanGridSlice> = {
  'planck18-bk18@1': slice('deltaChi2', [[30, 12, 8], [16, 0.4, 1], [9, 1.2, 0.9]], status, axes),
  'pact-lb-bk18@1': slice('deltaChi2', [[50, 30, 20], [25, 6, 4], [15, 3, 1]], status, axes),
};
const gridAnswer = (request: { url: URL }) => {
  const output = request.url.searchParams.get('output') ?? 'ns';
  return json(200, output === 'deltaChi2' ? chi2Of[request.url.searchParams.get('likelihood') ?? ''] : slices[output]);
};
const plane = {
  okPoints: 2, stride: 1, axisStrides: [1, 1], parameters: ['f', 'nStar'], pointIndex: [0, 4], ns: [0.958, 0.9649], r: [0.05, 0.03], alphaS: [-6e-4, -5e-4], nStar: [50, 55],
  inputs: { f: [5, 7], nStar: [50, 55] },
};

const region = (id: number, groupId: number, name: string): ConstraintRegion => ({
  id, groupId, name, source: 'Invented survey DR2', confidenceLevel: 0.95,
  vertices: [{ ns: 0.955, r: 0 }, { ns: 0.975, r: 0 }, { ns: 0.965, r: 0.04 }], createdById: 2, createdAt: '2026-12-01T10:00:00.000Z',
});
const regionsOf: Readonly<Record<string, ConstraintRegion[]>> = { 10: [region(1, 10, 'Survey A')], 11: [region(2, 11, 'Survey D')] };

function mockCompare() {
  return mockApi({
    'GET /api/auth/me': () => json(200, adminUser),
    'GET /api/scans': () =>
      json(200, {
        items: [
          scan({ id: 42, name: details[42].name, status: 'completed', groupId: 10 }),
          scan({ id: 43, name: details[43].name, status: 'completed', groupId: 11 }),
        ],
        total: 2, page: 1, pageSize: 100,
      }),
    'GET /api/scans/42': () => json(200, details[42]),
    'GET /api/scans/43': () => json(200, details[43]),
    'GET /api/scans/42/grid': gridAnswer,
    'GET /api/scans/43/grid': gridAnswer,
    'GET /api/likelihood-sets': () => json(200, [likelihoodSet(), pactSet]),
    'GET /api/scans/42/plane': () => json(200, plane),
    'GET /api/scans/43/plane': () => json(200, plane),
    'GET /api/constraint-regions': (request) => json(200, regionsOf[request.url.searchParams.get('groupId') ?? ''] ?? []),
    'GET /api/scans/evidence': () =>
      json(200, {
        referenceId: 42,
        note: 'The evidence depends on the prior ranges (the axes) each scan chose.',
        sets: [likelihoodSet(), pactSet].map((set) => ({
          likelihood: judgedBy(set),
          scans: [
            { scanId: 43, name: secondSpec.name, rank: 1, lnZ: -1.1, lnZError: 0.01, included: 9, excluded: 0, lnB: 1.2, twoLnB: 2.4, verdict: 'positive' },
            { scanId: 42, name: details[42].name, rank: 2, lnZ: -2.3, lnZError: 0.01, included: 9, excluded: 0, lnB: 0, twoLnB: 0, verdict: 'reference' },
          ],
        })),
      }),
  });
}

const regionTraceNames = (chart: HTMLElement) =>
  plotIn(chart).data.filter((trace) => trace.name?.includes('Invented survey DR2')).map((trace) => trace.name);

describe('compare page plane', () => {
  it('outlines the regions of every compared scan’s group, each with its own switch', async () => {
    const { requests } = mockCompare();
    const { user } = renderApp('/compare?scans=42,43');

    const chart = await screen.findByRole('img', { name: /^n_s–r plane of Natural inflation, f against N_\*, Natural inflation, second look/ }, slow);
    const toggles = (await screen.findByText('Your groups’ constraint regions', undefined, slow)).closest('fieldset')!;
    const a = within(toggles).getByRole('checkbox', { name: 'Survey A (95% CL, Invented survey DR2)' });
    const d = within(toggles).getByRole('checkbox', { name: 'Survey D (95% CL, Invented survey DR2)' });
    expect(a).toBeChecked();
    expect(d).toBeChecked();
    await waitFor(() => expect(regionTraceNames(chart)).toEqual(['Survey A (95% CL, Invented survey DR2)', 'Survey D (95% CL, Invented survey DR2)']));

    await user.click(d);
    await waitFor(() => expect(regionTraceNames(chart)).toEqual(['Survey A (95% CL, Invented survey DR2)']));
    expect(d).not.toBeChecked();
    await user.click(a);
    await waitFor(() => expect(regionTraceNames(chart)).toEqual([]));
    expect(screen.queryByText(/^Outlines: constraint regions/)).not.toBeInTheDocument();
    await user.click(d);
    await waitFor(() => expect(regionTraceNames(chart)).toEqual(['Survey D (95% CL, Invented survey DR2)']));

    const asked = requests.filter((r) => r.url.pathname === '/api/constraint-regions').map((r) => r.url.searchParams.get('groupId'));
    expect([...new Set(asked)].sort()).toEqual(['10', '11']);
  });
});

describe('compare page regions', () => {
  type Trace = { type: string; name?: string; fill?: string; z?: unknown; line?: { color?: string } };

  it('draws every chosen set on every map and on the plane, each in its own colour, until a set is unticked', async () => {
    const { requests } = mockCompare();
    const { user, router } = renderApp('/compare?scans=42,43');

    const chart = await screen.findByRole('img', { name: /^n_s–r plane of .* with the regions of Planck 2018 \+ BICEP\/Keck 2018 and P-ACT-LB \+ BICEP\/Keck 2018$/ }, slow);
    const filled = () => (plotIn(chart).data as Trace[]).filter((t) => t.fill === 'toself').map((t) => t.name);
    expect(filled()).toEqual([
      'Planck 2018 + BICEP/Keck 2018: 95.4 % (Δχ² ≤ 6.18)', 'P-ACT-LB + BICEP/Keck 2018: 95.4 % (Δχ² ≤ 6.18)',
      'Planck 2018 + BICEP/Keck 2018: 68.3 % (Δχ² ≤ 2.30)', 'P-ACT-LB + BICEP/Keck 2018: 68.3 % (Δχ² ≤ 2.30)',
    ]);

    // Each scan's map carries both sets' lines, drawn from that set's Δχ² of that scan.
    const maps = await screen.findAllByRole('img', { name: 'Heatmap of n_s over f and N_*' }, slow);
    expect(maps).toHaveLength(2);
    const [map] = maps;
    const lines = (el: HTMLElement) => (plotIn(el).data as Trace[]).filter((t) => t.type === 'contour');
    await waitFor(() => expect(lines(maps[1])).toHaveLength(8), slow);
    expect(lines(map)[0].z).toEqual([[30, 12, 8], [16, 0.4, 1], [9, 1.2, 0.9]]);
    expect(lines(map)[4].z).toEqual([[50, 30, 20], [25, 6, 4], [15, 3, 1]]);
    expect(lines(map)[1].line?.color).not.toBe(lines(map)[5].line?.color);
    const asked = requests.filter((r) => r.url.searchParams.get('output') === 'deltaChi2').map((r) => `${r.url.pathname} ${r.url.searchParams.get('likelihood')}`);
    expect(new Set(asked)).toEqual(new Set(['/api/scans/42/grid planck18-bk18@1', '/api/scans/42/grid pact-lb-bk18@1', '/api/scans/43/grid planck18-bk18@1', '/api/scans/43/grid pact-lb-bk18@1']));

    await user.click(screen.getByRole('checkbox', { name: 'Planck 2018 + BICEP/Keck 2018 (planck18-bk18 v1)' }));
    await waitFor(() => expect(router.state.location.search).toContain('likelihood=pact-lb-bk18%401'), slow);
    await waitFor(() => expect(filled()).toEqual(['P-ACT-LB + BICEP/Keck 2018: 95.4 % (Δχ² ≤ 6.18)', 'P-ACT-LB + BICEP/Keck 2018: 68.3 % (Δχ² ≤ 2.30)']), slow);
    await waitFor(() => expect(lines(maps[0])).toHaveLength(4), slow);
  });
});

describe('compare page evidence', () => {
  it('ranks the compared scans by evidence under Planck and P-ACT-LB side by side', async () => {
    mockCompare();
    renderApp('/compare?scans=42,43');
    const planck = await screen.findByRole('table', { name: 'Evidence under Planck 2018 + BICEP/Keck 2018 (planck18-bk18 v1)' }, slow);
    expect(within(planck).getAllByRole('row')[1]).toHaveTextContent(/^1Natural inflation, second look/);
    expect(within(planck).getAllByRole('row')[1]).toHaveTextContent('positive');
    expect(screen.getByRole('table', { name: 'Evidence under P-ACT-LB + BICEP/Keck 2018 (pact-lb-bk18 v1)' })).toBeInTheDocument();
  });
});
