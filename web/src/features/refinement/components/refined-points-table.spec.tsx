import type { RefinedPoint } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { likelihoodSet, pactSet } from '@/testing/scan-fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { RefinedPointsTable } from './refined-points-table';

const point = (scanId: number, level: number, pointIndex: number, overrides: Partial<RefinedPoint> = {}): RefinedPoint => ({
  scanId, level, pointIndex, inputs: { alpha: 1, nStar: 50 }, status: 'ok', failureReason: null,
  ns: 0.965, r: 0.004, alphaS: -6e-4, As: 2.1e-9, amplitudeScale: 1, nTotal: 70, nStar: 50, phiStar: 3, phiEnd: 0.5, energyScaleGeV: 1e16,
  ...overrides,
});

const useSets = () => ({ data: [likelihoodSet(), pactSet] });

/** The merged table's API answering a page of two levels' points (120 in all, so there is a next page), judged when asked. */
function mockMerged() {
  return mockApi({
    'GET /api/scans/42/refinement/points': (request) => {
      const judged = request.url.searchParams.get('likelihood') ? { deltaChi2: 2.3, confidence: 0.6827 } : {};
      return json(200, {
        items: [point(42, 0, 7, { ns: 0.961, ...judged }), point(43, 1, 2, { ns: 0.962, inputs: { alpha: 3, nStar: 55 }, ...judged })],
        total: 120, page: Number(request.url.searchParams.get('page') ?? 1), pageSize: 50, parentScanId: 42, levelScanIds: [43],
        ...(request.url.searchParams.get('likelihood') && { judgedBy: request.url.searchParams.get('likelihood') }),
      });
    },
  });
}

const lastQuery = (requests: ReturnType<typeof mockApi>['requests']) => Object.fromEntries(requests.at(-1)!.url.searchParams);

describe('the points of every level', () => {
  it('shows each point\'s level, scan and the points table\'s columns, in level order first', async () => {
    const { requests } = mockMerged();
    renderWithProviders(<RefinedPointsTable scanId={42} axes={['alpha', 'nStar']} useLikelihoodSets={useSets} />);
    const table = await screen.findByRole('table', { name: 'Points of every level' });
    const [header, ...rows] = within(table).getAllByRole('row');
    const headers = within(header).getAllByRole('columnheader').map((cell) => cell.textContent);
    expect(headers.slice(0, 5)).toEqual(['Level↑', 'Scan', 'Point', 'alpha↕', 'N_*↕']);
    expect(headers).toContain('n_s↕');
    expect(within(header).getAllByRole('columnheader')[0]).toHaveAttribute('aria-sort', 'ascending');
    expect(rows.map((row) => within(row).getAllByRole('cell').slice(0, 4).map((cell) => cell.textContent))).toEqual([['0', '42', '7', '1'], ['1', '43', '2', '3']]);
    expect(within(rows[1]).getByRole('link', { name: 'Open point 2 of scan 43' })).toHaveAttribute('href', '/scans/43/points/2');
    expect(lastQuery(requests)).toEqual({ pageSize: '50' });
  });

  it('sorts by a column header, both ways, and back to level order', async () => {
    const { requests } = mockMerged();
    const { user } = renderWithProviders(<RefinedPointsTable scanId={42} axes={['alpha', 'nStar']} useLikelihoodSets={useSets} />);
    await screen.findByRole('table', { name: 'Points of every level' });

    await user.click(screen.getByRole('button', { name: 'Sort by n_s' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ sort: 'ns', order: 'asc', pageSize: '50' }));
    await user.click(screen.getByRole('button', { name: 'Sort by n_s, now ascending' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ sort: 'ns', order: 'desc', pageSize: '50' }));
    // Paging keeps the sort.
    await user.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ sort: 'ns', order: 'desc', page: '2', pageSize: '50' }));
    await user.click(screen.getByRole('button', { name: 'Sort by alpha' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ sort: 'input.alpha', order: 'asc', pageSize: '50' }));
    await user.click(screen.getByRole('button', { name: 'Sort by Level' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ sort: 'pointIndex', order: 'asc', pageSize: '50' }));
  });

  it('filters by status, an input and an output range, and judges by a likelihood set', async () => {
    const { requests } = mockMerged();
    const { user } = renderWithProviders(<RefinedPointsTable scanId={42} axes={['alpha', 'nStar']} useLikelihoodSets={useSets} />);
    await screen.findByRole('table', { name: 'Points of every level' });

    await user.selectOptions(screen.getByLabelText('Status'), 'ok');
    await waitFor(() => expect(lastQuery(requests)).toEqual({ status: 'ok', pageSize: '50' }));
    await user.selectOptions(screen.getByLabelText('Filter column'), 'input.alpha');
    await user.type(screen.getByLabelText('From'), '2');
    await user.click(screen.getByRole('button', { name: 'Apply filter' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ status: 'ok', 'input.alpha_min': '2', pageSize: '50' }));
    await user.selectOptions(screen.getByLabelText('Filter column'), 'ns');
    await user.type(screen.getByLabelText('To'), '0.97');
    await user.click(screen.getByRole('button', { name: 'Apply filter' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ status: 'ok', 'input.alpha_min': '2', ns_max: '0.97', pageSize: '50' }));
    expect(within(screen.getByLabelText('Active filters')).getByText('2 ≤ alpha ≤ ∞')).toBeInTheDocument();

    await user.selectOptions(screen.getByLabelText('Likelihood set'), 'pact-lb-bk18@1');
    await waitFor(() => expect(lastQuery(requests)).toMatchObject({ likelihood: 'pact-lb-bk18@1' }));
    const table = await screen.findByRole('table', { name: 'Points of every level' });
    await waitFor(() => expect(within(table).getAllByRole('row')[1]).toHaveTextContent('68.3 %'));
    await user.click(within(table).getByRole('button', { name: 'Sort by Δχ²' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({
      status: 'ok', 'input.alpha_min': '2', ns_max: '0.97', likelihood: 'pact-lb-bk18@1', sort: 'deltaChi2', order: 'asc', pageSize: '50',
    }));
    // Without a set the Δχ² sort goes too.
    await user.selectOptions(screen.getByLabelText('Likelihood set'), '');
    await waitFor(() => expect(lastQuery(requests)).toEqual({ status: 'ok', 'input.alpha_min': '2', ns_max: '0.97', order: 'asc', pageSize: '50' }));

    await user.click(screen.getByRole('button', { name: 'Remove the filter on alpha' }));
    await waitFor(() => expect(lastQuery(requests)).toEqual({ status: 'ok', ns_max: '0.97', order: 'asc', pageSize: '50' }));
  });
});
