import { screen, waitFor, within } from '@testing-library/react';
import { json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { scanDetail } from '@/testing/scan-fixtures';
import { RefineDialog } from './refine-dialog';
import { ScanLineage } from './scan-lineage';

const estimate = { level: 1, cells: 4, crossedCells: 2, points: 10, parentPoints: 9, pointsPerSecond: 5, seconds: 2, finestLengths: [9, 9] };

describe('refining a scan', () => {
  it('shows the first level\'s estimate before launch, and launches with the settings', async () => {
    const launched = vi.fn();
    const { requests } = mockApi({
      'GET /api/scans/42/refine/estimate': () => json(200, estimate),
      'POST /api/scans/42/refine': () => json(201, scanDetail({ id: 43, name: 'refined' })),
      'GET /api/scans/42/lineage': () => json(200, { parentScanId: null, level: null, levels: [] }),
    });
    const { user } = renderWithProviders(<RefineDialog scan={scanDetail()} onClose={() => {}} onLaunched={launched} />);
    expect(await screen.findByTestId('refine-estimate')).toHaveTextContent('Level 1: 10 points in 2 of 4 cells, about a few seconds at this scan\'s pace; the finest level has 9 × 9 nodes.');
    const asked = requests.find((r) => r.url.pathname.endsWith('/estimate'))!.url.searchParams;
    expect(Object.fromEntries(asked)).toEqual({ boundary: 'likelihood', likelihood: 'planck18-bk18', level: '95', 'factor.f': '2', 'factor.nStar': '2', depth: '3' });

    await user.selectOptions(screen.getByLabelText('Factor on nStar'), '1');
    await waitFor(() => expect(requests.some((r) => r.url.searchParams.get('factor.nStar') === '1')).toBe(true));
    await user.click(screen.getByRole('button', { name: 'Launch refinement' }));
    await waitFor(() => expect(launched).toHaveBeenCalledWith(expect.objectContaining({ id: 43 })));
    expect(requests.find((r) => r.method === 'POST')!.body).toEqual({
      boundary: { kind: 'likelihood', likelihood: 'planck18-bk18', level: 95 }, factors: { f: 2, nStar: 1 }, depth: 3,
    });
  });

  it('says why the settings refine nothing, and does not launch', async () => {
    mockApi({ 'GET /api/scans/42/refine/estimate': () => json(409, { statusCode: 409, error: 'Conflict', message: 'The boundary crosses no cell of scan 42: nothing to refine' }) });
    renderWithProviders(<RefineDialog scan={scanDetail()} onClose={() => {}} onLaunched={() => {}} />);
    expect(await screen.findByText('The boundary crosses no cell of scan 42: nothing to refine')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Launch refinement' })).toBeDisabled();
  });

  it('links a level to its parent and its sibling levels', async () => {
    mockApi({
      'GET /api/scans/43/lineage': () => json(200, {
        parentScanId: 42, level: 1,
        levels: [{ scanId: 43, level: 1, name: 'a', status: 'completed', totalPoints: 10 }, { scanId: 44, level: 2, name: 'b', status: 'running', totalPoints: 20 }],
        chaining: false,
      }),
    });
    renderWithProviders(<ScanLineage scanId={43} axes={['alpha', 'nStar']} useLikelihoodSets={() => ({ data: [] })} onLevelCompleted={() => {}} />);
    expect(await screen.findByRole('link', { name: 'scan 42' })).toHaveAttribute('href', '/scans/42');
    expect(screen.getByRole('link', { name: 'level 2 · 20 points · running' })).toHaveAttribute('href', '/scans/44');
  });

  it('lists every level\'s points with their level on demand', async () => {
    const point = (scanId: number, level: number, pointIndex: number) => ({
      scanId, level, pointIndex, inputs: { alpha: 1, nStar: 50 }, status: 'ok', failureReason: null, ns: 0.965, r: 0.004, alphaS: null, As: null,
      amplitudeScale: null, nTotal: null, nStar: 50, phiStar: null, phiEnd: null, energyScaleGeV: null,
    });
    const { requests } = mockApi({
      'GET /api/scans/42/lineage': () => json(200, { parentScanId: null, level: null, levels: [{ scanId: 43, level: 1, name: 'a', status: 'completed', totalPoints: 1 }], chaining: false }),
      'GET /api/scans/42/refinement/points': () => json(200, { items: [point(42, 0, 0), point(43, 1, 0)], total: 2, page: 1, pageSize: 50, parentScanId: 42, levelScanIds: [43] }),
    });
    const { user } = renderWithProviders(<ScanLineage scanId={42} axes={['alpha', 'nStar']} useLikelihoodSets={() => ({ data: [] })} onLevelCompleted={() => {}} />);
    await user.click(await screen.findByRole('button', { name: 'Points of every level' }));
    const table = await screen.findByRole('table', { name: 'Points of every level' });
    const rows = within(table).getAllByRole('row').slice(1).map((row) => within(row).getAllByRole('cell').slice(0, 3).map((cell) => cell.textContent));
    expect(rows).toEqual([['0', '42', '0'], ['1', '43', '0']]);
    expect(Object.fromEntries(requests.find((r) => r.url.pathname.endsWith('/refinement/points'))!.url.searchParams)).toEqual({ pageSize: '50' });
  });

  it('keeps asking while the API has a finished level to follow, and says when a new level completes', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true });
    try {
      const level = (scanId: number, n: number, status: string) => ({ scanId, level: n, name: `level ${n}`, status, totalPoints: 10 });
      const answers = [
        { parentScanId: null, level: null, levels: [level(43, 1, 'completed')], chaining: true },
        { parentScanId: null, level: null, levels: [level(43, 1, 'completed'), level(44, 2, 'completed')], chaining: true },
        { parentScanId: null, level: null, levels: [level(43, 1, 'completed'), level(44, 2, 'completed')], chaining: false },
      ];
      let asked = 0;
      mockApi({ 'GET /api/scans/42/lineage': () => json(200, answers[Math.min(asked++, answers.length - 1)]) });
      const onLevelCompleted = vi.fn();
      renderWithProviders(<ScanLineage scanId={42} axes={['alpha', 'nStar']} useLikelihoodSets={() => ({ data: [] })} onLevelCompleted={onLevelCompleted} />);
      await screen.findByRole('link', { name: 'level 1 · 10 points · completed' });
      // Level 1 was complete when the page opened: nothing new yet.
      expect(onLevelCompleted).not.toHaveBeenCalled();
      await vi.advanceTimersByTimeAsync(5_000);
      await screen.findByRole('link', { name: 'level 2 · 10 points · completed' });
      expect(onLevelCompleted).toHaveBeenCalledTimes(1);
      // Once the API has followed every finished level, the lineage stops asking.
      await vi.advanceTimersByTimeAsync(5_000);
      await waitFor(() => expect(asked).toBe(3));
      await vi.advanceTimersByTimeAsync(15_000);
      expect(asked).toBe(3);
      expect(onLevelCompleted).toHaveBeenCalledTimes(1);
    } finally {
      vi.useRealTimers();
    }
  });
});
