import type { Reproduction, ReproductionList } from '@sixtyfold/shared';
import { POINT_OUTPUTS } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { ScanReproducibility } from './scan-reproducibility';

const today = { engineVersion: '0.2.0', commit: 'b'.repeat(40), node: 'v20.20.2' };
const scanBuild = { engineVersion: '0.1.0', commit: 'a'.repeat(40), node: 'v20.20.2' };
const check = (over: Partial<Reproduction> = {}): Reproduction => ({
  id: 5, scanId: 42, status: 'completed', sampleSize: 20, pointIndices: [1, 2], requestedByName: 'Lucia Marín', requestedAt: '2026-12-01T10:00:00.000Z',
  finishedAt: '2026-12-01T10:00:03.000Z', scanBuild, checkedBuild: { ...today, worker: 'node-b:202' }, error: null,
  report: {
    identical: false,
    statusChanges: [],
    outputs: POINT_OUTPUTS.map((output) => (output === 'ns'
      ? { output, compared: 20, identical: false, differing: 1, maxRelativeDifference: 1.5e-9, atPointIndex: 17 }
      : { output, compared: 20, identical: true, differing: 0, maxRelativeDifference: null, atPointIndex: null })),
  },
  ...over,
});

describe('Check reproducibility', () => {
  it('says the build changed before the report, and reports each output', async () => {
    mockApi({ 'GET /api/scans/42/reproductions': () => json(200, { today, scanBuild, items: [check()] } satisfies ReproductionList) });
    renderWithProviders(<ScanReproducibility scanId={42} canCheck />);
    const section = await screen.findByRole('region', { name: 'Reproducibility' });
    const warning = within(section).getByText(/Today's build differs/);
    const table = within(section).getByRole('table', { name: 'Reproducibility by output' });
    // The warning comes first in the page.
    expect(warning.compareDocumentPosition(table) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(warning.textContent).toContain("engine 0.2.0 (the scan's: 0.1.0)");
    const rows = within(table).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell').map((c) => c.textContent));
    expect(rows[0][1]).toBe('different at 1 point: largest relative difference 1.5e-9 at point 17');
    expect(rows.slice(1).every(([, result]) => result === 'identical')).toBe(true);
  });

  it('starts a check with the asked sample size, and refuses one out of range', async () => {
    const posted: unknown[] = [];
    mockApi({
      'GET /api/scans/42/reproductions': () => json(200, { today, scanBuild: today, items: [] }),
      'POST /api/scans/42/reproductions': (request) => {
        posted.push(request.body);
        return json(201, check({ status: 'queued', report: null, checkedBuild: null }));
      },
    });
    const { user } = renderWithProviders(<ScanReproducibility scanId={42} canCheck />);
    const input = await screen.findByLabelText('Points to recompute');
    expect(screen.queryByText(/Today's build differs/)).not.toBeInTheDocument();
    await user.clear(input);
    await user.type(input, '5000');
    expect(screen.getByRole('button', { name: 'Check reproducibility' })).toBeDisabled();
    await user.clear(input);
    await user.type(input, '50');
    await user.click(screen.getByRole('button', { name: 'Check reproducibility' }));
    await waitFor(() => expect(posted).toEqual([{ sampleSize: 50 }]));
  });

  it('offers no button to a viewer', async () => {
    mockApi({ 'GET /api/scans/42/reproductions': () => json(200, { today, scanBuild: today, items: [] }) });
    renderWithProviders(<ScanReproducibility scanId={42} canCheck={false} />);
    expect(await screen.findByText('No reproducibility check yet.')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Check reproducibility' })).not.toBeInTheDocument();
  });
});
