import type { ScanDetail, ScanPointDto } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { Route, Routes, useLocation } from 'react-router-dom';
import { scan } from '@/testing/fixtures';
import { likelihoodSet, naturalSpec, pactSet } from '@/testing/scan-fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { ScanPointsTable } from './points-table';

const detail: ScanDetail = {
  ...scan({ status: 'completed', totalPoints: 4, donePoints: 3, failedPoints: 1 }),
  note: '',
  startedAt: null,
  spec: { ...naturalSpec, axes: [{ kind: 'list', parameter: 'f', values: [5, 7] }, { kind: 'list', parameter: 'nStar', values: [50, 60] }] },
  progress: { total: 4, done: 3, failed: 1, running: 0, queued: 0, elapsedSeconds: 2, remainingSeconds: null },
};

const point = (pointIndex: number, overrides: Partial<ScanPointDto> = {}): ScanPointDto => ({
  pointIndex, inputs: { f: 5, nStar: 50 }, status: 'ok', failureReason: null,
  ns: 0.96, r: 0.05, alphaS: -6e-4, As: 1e-9, amplitudeScale: 2.1, nTotal: 70, nStar: 50, phiStar: 3, phiEnd: 0.5, energyScaleGeV: 1.6e16,
  ...overrides,
});

function Location() {
  const location = useLocation();
  return <output aria-label="address">{location.search}</output>;
}

function renderTable(route = '/scans/101?view=points') {
  return renderWithProviders(
    <Routes>
      <Route path="/scans/:scanId" element={<><ScanPointsTable scan={detail} /><Location /></>} />
    </Routes>,
    { route },
  );
}

describe('points table', () => {
  it('judges the points by a chosen likelihood set: Δχ² (sortable) and the confidence level', async () => {
    const { requests } = mockApi({
      'GET /api/likelihood-sets': () => json(200, [likelihoodSet(), pactSet]),
      'GET /api/scans/101/points': () =>
        json(200, { items: [point(0, { deltaChi2: 6.18, confidence: 0.9545 }), point(1, { status: 'no_end', failureReason: 'ends nowhere', ns: null, r: null, deltaChi2: null, confidence: null })], total: 2, page: 1, pageSize: 50 }),
    });
    const { user } = renderTable('/scans/101?view=points&likelihood=pact-lb-bk18@1');
    const table = await screen.findByRole('table', { name: 'Points of the scan' });
    const rows = within(table).getAllByRole('row');
    expect(rows[0]).toHaveTextContent('Δχ²');
    expect(rows[1]).toHaveTextContent('6.18');
    expect(rows[1]).toHaveTextContent('95.5 %');
    expect(requests.some((r) => r.url.pathname === '/api/scans/101/points' && r.url.searchParams.get('likelihood') === 'pact-lb-bk18@1')).toBe(true);
    await user.click(within(table).getByRole('button', { name: /Sort by Δχ²/ }));
    await waitFor(() => expect(screen.getByLabelText('address')).toHaveTextContent('sort=deltaChi2'));
    // Without a set the columns and the Δχ² sort go.
    await user.selectOptions(screen.getByLabelText('Likelihood set'), '');
    await waitFor(() => expect(screen.getByLabelText('address')).not.toHaveTextContent('deltaChi2'));
    expect(within(await screen.findByRole('table', { name: 'Points of the scan' })).getAllByRole('row')[0]).not.toHaveTextContent('Δχ²');
  });


  it('shows axis inputs and outputs, and failures by reason instead of numbers', async () => {
    mockApi({
      'GET /api/scans/101/points': () =>
        json(200, {
          items: [point(0), point(1, { status: 'insufficient_efolds', failureReason: 'only 40 e-folds', ns: null, r: null })],
          total: 2, page: 1, pageSize: 50,
        }),
    });
    renderTable();
    const table = await screen.findByRole('table', { name: 'Points of the scan' });
    const rows = within(table).getAllByRole('row');
    expect(rows[0]).toHaveTextContent('f');
    expect(rows[0]).toHaveTextContent('N_*');
    // N_* is an axis, so it is not repeated among the outputs.
    expect(within(rows[0]).getAllByText(/N_\*/)).toHaveLength(1);
    expect(rows[1]).toHaveTextContent('0.96');
    expect(rows[2]).toHaveTextContent('insufficient_efolds');
    expect(rows[2]).toHaveTextContent('only 40 e-folds');
    expect(within(rows[2]).getAllByText('—').length).toBeGreaterThanOrEqual(2);
    expect(within(rows[1]).getByRole('link', { name: 'Open point 0' })).toHaveAttribute('href', '/scans/101/points/0');
  });

  it('sorts, filters and exports through the API query, kept in the address', async () => {
    const { requests } = mockApi({
      'GET /api/scans/101/points': () => json(200, { items: [point(0)], total: 1, page: 1, pageSize: 50 }),
    });
    const { user } = renderTable();
    await screen.findByRole('table', { name: 'Points of the scan' });

    await user.click(screen.getByRole('button', { name: 'Sort by r' }));
    await waitFor(() => expect(requests.at(-1)!.url.searchParams.get('sort')).toBe('r'));
    expect(requests.at(-1)!.url.searchParams.get('order')).toBe('asc');
    await user.click(screen.getByRole('button', { name: 'Sort by r, now ascending' }));
    await waitFor(() => expect(requests.at(-1)!.url.searchParams.get('order')).toBe('desc'));

    await user.selectOptions(screen.getByLabelText('Filter column'), 'input.f');
    await user.type(screen.getByLabelText('From'), '6');
    await user.click(screen.getByRole('button', { name: 'Apply filter' }));
    await waitFor(() => expect(requests.at(-1)!.url.searchParams.get('input.f_min')).toBe('6'));
    expect(screen.getByLabelText('address')).toHaveTextContent('view=points');
    expect(screen.getByLabelText('address')).toHaveTextContent('input.f_min=6');

    const csv = screen.getByRole('link', { name: 'CSV' });
    const href = new URL(csv.getAttribute('href')!, 'http://sixtyfold.test');
    expect(href.pathname).toBe('/api/scans/101/points');
    expect(Object.fromEntries(href.searchParams)).toEqual({ sort: 'r', order: 'desc', 'input.f_min': '6', format: 'csv' });
    expect(screen.getByText('Download the filtered points:')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Remove the filter on f' }));
    await waitFor(() => expect(screen.getByLabelText('address')).not.toHaveTextContent('input.f_min'));
    expect(screen.getByText('Download every point:')).toBeInTheDocument();
  });

  it('refuses a bound that is not a number before asking the API', async () => {
    const { requests } = mockApi({
      'GET /api/scans/101/points': () => json(200, { items: [point(0)], total: 1, page: 1, pageSize: 50 }),
    });
    const { user } = renderTable();
    await screen.findByRole('table', { name: 'Points of the scan' });
    const before = requests.length;
    await user.type(screen.getByLabelText('To'), '0.9x');
    expect(screen.getByRole('alert')).toHaveTextContent('The upper bound is not a number');
    expect(screen.getByRole('button', { name: 'Apply filter' })).toBeDisabled();
    expect(requests.length).toBe(before);
  });
});
