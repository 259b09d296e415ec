import { screen, waitFor } from '@testing-library/react';
import { json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { ScanCitation } from './scan-citation';

const bibtex = '@software{sixtyfold010,\n  title = {{Sixtyfold}},\n  version = {0.1.0}\n}\n';

describe('the citation block', () => {
  it("asks for the picked likelihood's sources, shows the BibTeX, copies it and links the .bib file", async () => {
    const { requests } = mockApi({ 'GET /api/scans/42/citation': () => json(200, { scanId: 42, keys: ['sixtyfold010'], bibtex }) });
    const { user } = renderWithProviders(<ScanCitation scanId={42} />, { route: '/scans/42?view=computed&likelihood=planck18-bk18@1,pact-lb-bk18' });
    expect((await screen.findByLabelText('BibTeX')).textContent).toBe(bibtex);
    expect(requests[0].url.searchParams.get('likelihood')).toBe('planck18-bk18@1');
    expect(screen.getByRole('link', { name: 'Download .bib' })).toHaveAttribute('href', '/api/scans/42/citation?likelihood=planck18-bk18%401&format=bib');
    await user.click(screen.getByRole('button', { name: /Copy BibTeX/ }));
    await waitFor(async () => expect(await navigator.clipboard.readText()).toBe(bibtex));
  });

  it('asks without a likelihood when none is picked', async () => {
    const { requests } = mockApi({ 'GET /api/scans/42/citation': () => json(200, { scanId: 42, keys: ['sixtyfold010'], bibtex }) });
    renderWithProviders(<ScanCitation scanId={42} />, { route: '/scans/42' });
    expect(await screen.findByText(/Pick a likelihood on the Constraints tab/)).toBeInTheDocument();
    expect(requests[0].url.searchParams.has('likelihood')).toBe(false);
  });
});
