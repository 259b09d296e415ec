import type { EvidenceComparison } from '@sixtyfold/shared';
import { screen, within } from '@testing-library/react';
import { Route, Routes } from 'react-router-dom';
import { json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { judgedBy, likelihoodSet, naturalSpec, pactSet, scanDetail } from '@/testing/scan-fixtures';
import { EvidenceTables } from './evidence-tables';

const natural = scanDetail({ id: 3, name: 'Natural inflation' });
const attractor = scanDetail({ id: 5, name: 'T-model attractor' });
const listed = scanDetail({ id: 8, name: 'Hand-picked points' }, { ...naturalSpec, axes: undefined, pointList: { columns: ['f', 'nStar'], rows: [[5, 50]] } });

const row = (scanId: number, name: string, rank: number, lnZ: number, lnB: number, verdict: string) => ({
  scanId, name, rank, lnZ, lnZError: 0.02, included: 9, excluded: 0, lnB, twoLnB: 2 * lnB, verdict,
});

/** The API's answer with `reference` as the reference: ranked best first under each set. */
const comparison = (reference: number): EvidenceComparison => ({
  referenceId: reference,
  note: 'The evidence depends on the prior ranges (the axes) each scan chose.',
  sets: [
    { likelihood: judgedBy(likelihoodSet()), scans: [row(5, 'T-model attractor', 1, -1.2, 3.4, 'strong'), row(3, 'Natural inflation', 2, -4.6, 0, 'reference')] },
    { likelihood: judgedBy(pactSet), scans: [row(5, 'T-model attractor', 1, -2.0, 0.7, 'not worth more than a bare mention'), row(3, 'Natural inflation', 2, -2.7, 0, 'reference')] },
  ],
});

function renderTables(route = '/compare?scans=3,5,8') {
  return renderWithProviders(
    <Routes>
      <Route path="/compare" element={<EvidenceTables scans={[natural, attractor, listed]} />} />
    </Routes>,
    { route },
  );
}

describe('evidence tables', () => {
  it('ranks the grid scans under Planck and P-ACT-LB side by side, with ln B, 2 ln B and the verdict against the first scan', async () => {
    const { requests } = mockApi({ 'GET /api/scans/evidence': (request) => json(200, comparison(Number(request.url.searchParams.get('reference')))) });
    renderTables();
    const planck = await screen.findByRole('table', { name: 'Evidence under Planck 2018 + BICEP/Keck 2018 (planck18-bk18 v1)' });
    const pact = screen.getByRole('table', { name: 'Evidence under P-ACT-LB + BICEP/Keck 2018 (pact-lb-bk18 v1)' });
    const planckRows = within(planck).getAllByRole('row');
    expect(planckRows[1]).toHaveTextContent(/^1T-model attractor−1.2 ± 0.023.46.8strong$/);
    expect(planckRows[2]).toHaveTextContent('Natural inflation');
    expect(planckRows[2]).toHaveTextContent('reference');
    expect(within(pact).getAllByRole('row')[1]).toHaveTextContent('not worth more than a bare mention');
    expect(screen.getByText(/depends on the prior ranges/)).toBeInTheDocument();
    // The list scan is named and left out of the request; the first grid scan is the reference.
    expect(screen.getByText(/Left out: Hand-picked points/)).toBeInTheDocument();
    const asked = requests[0].url.searchParams;
    expect(asked.get('ids')).toBe('3,5');
    expect(asked.get('likelihoods')).toBe('planck18-bk18,pact-lb-bk18');
    expect(asked.get('reference')).toBe('3');
    expect(within(planckRows[1]).getByRole('link', { name: 'T-model attractor' })).toHaveAttribute('href', '/scans/5?view=constraints&likelihood=planck18-bk18@1');
  });

  it('asks again against the reference picked', async () => {
    const { requests } = mockApi({ 'GET /api/scans/evidence': (request) => json(200, comparison(Number(request.url.searchParams.get('reference')))) });
    const { user } = renderTables();
    await screen.findAllByRole('table');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Reference scan' }), 'T-model attractor');
    await vi.waitFor(() => expect(requests.at(-1)?.url.searchParams.get('reference')).toBe('5'));
  });
});
