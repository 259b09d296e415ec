import type { ConstraintRegion, CurrentUser, ScanGridSlice } from '@sixtyfold/shared';
import { act, screen, waitFor, within } from '@testing-library/react';
import { adminUser, memberUser } from '@/testing/fixtures';
import { plotIn } from '@/testing/plotly-chart-mock';
import { apiError, json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
import { likelihoodSet, naturalSpec, pactSet, scanDetail, slice } from '@/testing/scan-fixtures';

vi.mock('@/components/plots/plotly-chart', () => import('@/testing/plotly-chart-mock'));
// Whole pages with several queries each: give a busy machine time.
vi.setConfig({ testTimeout: 20_000 });
const slow = { timeout: 5_000 };

const viewer: CurrentUser = { ...memberUser, id: 3, memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'viewer' }] };

// The 3 × 3 grid of naturalSpec as the API slices it with x = f, y = N_*: z[iy][ix].
const status = [
  ['ok', 'ok', 'insufficient_efolds'],
  ['ok', 'ok', 'insufficient_efolds'],
  ['ok', 'ok', null],
];
const axes = { x: { parameter: 'f', values: [5, 7, 10] }, y: { parameter: 'nStar', values: [50, 55, 60] } };
const values: Record<string, (number | null)[][]> = {
  ns: [[0.955, 0.958, null], [0.961, 0.9649, null], [0.966, 0.967, null]],
  r: [[0.09, 0.05, null], [0.08, 0.03, null], [0.07, 0.02, null]],
  alphaS: [[-7e-4, -6e-4, null], [-6e-4, -5e-4, null], [-5e-4, -4e-4, null]],
  status: [[null, null, null], [null, null, null], [null, null, null]],
  // As the API judges these cells under planck18-bk18 (the numbers only need to differ per cell here).
  deltaChi2: [[30, 12, null], [16, 0.4, null], [9, 1.2, null]],
};
const slices: Record<string, ScanGridSlice> = Object.fromEntries(
  Object.entries(values).map(([output, z]) => [output, slice(output as ScanGridSlice['output'], z, status, axes)]),
);

function api(user: CurrentUser, detail = scanDetail(), extra: Record<string, (request: MockRequest) => Response> = {}) {
  return mockApi({
    'GET /api/auth/me': () => json(200, user),
    'GET /api/scans/42': () => json(200, detail),
    'GET /api/scans/42/grid': (request) => json(200, slices[request.url.searchParams.get('output') ?? 'ns']),
    'GET /api/likelihood-sets': () => json(200, [likelihoodSet(), pactSet]),
    ...extra,
  });
}

describe('scan page', () => {
  it('says who ran what, how it was set up and how far it got', async () => {
    api(memberUser, scanDetail({ status: 'running', donePoints: 120, failedPoints: 3, totalPoints: 400, finishedAt: null,
      progress: { total: 400, done: 120, failed: 3, running: 16, queued: 261, elapsedSeconds: 60, remainingSeconds: 90 } }));
    renderApp('/scans/42');

    expect(await screen.findByRole('heading', { level: 1, name: 'Natural inflation, f against N_*' }, slow)).toBeInTheDocument();
    expect(screen.getByText('Running')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Natural inflation' })).toHaveAttribute('href', '/models/families/natural');
    expect(screen.getByRole('link', { name: 'Plateau Lab' })).toHaveAttribute('href', '/groups/10');
    const settings = screen.getByRole('region', { name: 'Settings' });
    expect(within(settings).getByText('Slow-roll')).toBeInTheDocument();
    expect(within(settings).getByText('Lambda = 0.005')).toBeInTheDocument();
    expect(within(settings).getByText('N_* on an axis')).toBeInTheDocument();
    const axesTable = within(settings).getByRole('table', { name: 'Scan axes' });
    expect(within(axesTable).getAllByRole('row').map((row) => row.textContent)).toEqual([
      'fList of 3 values: 5, 7, 10',
      'N_*50 to 60, 3 values, linear spacing (varies fastest)',
    ]);
    const about = screen.getByRole('region', { name: 'About' });
    expect(within(about).getByText('axion')).toBeInTheDocument();
    expect(within(about).getByText('Where natural inflation meets the n_s window.')).toBeInTheDocument();

    const progress = screen.getByRole('region', { name: 'Progress' });
    expect(within(progress).getByRole('progressbar', { name: '123 of 400 points computed' })).toBeInTheDocument();
    expect(progress).toHaveTextContent('Done120');
    expect(progress).toHaveTextContent('Failed3');
    expect(progress).toHaveTextContent('Rate2.05 points/s');
    expect(progress).toHaveTextContent('Time leftabout 2 min');
    expect(progress).toHaveTextContent('Running · queued16 · 261');
  });

  it('offers the owner cancel and clone while it runs, and says why delete is missing', async () => {
    const { requests } = api(memberUser, scanDetail({ status: 'running', finishedAt: null }), {
      'POST /api/scans/42/cancel': () => apiError(409, 'The scan is completed; only queued or running scans can be cancelled'),
    });
    const { user } = renderApp('/scans/42');

    const cancel = await screen.findByRole('button', { name: 'Cancel scan' }, slow);
    expect(screen.getByRole('link', { name: 'Clone scan' })).toHaveAttribute('href', '/scans/new?from=42');
    expect(screen.queryByRole('button', { name: 'Delete scan' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Retry failed points' })).not.toBeInTheDocument();
    expect(screen.getByText('As a member of Plateau Lab you cannot delete it (leads).')).toBeInTheDocument();

    await user.click(cancel);
    const alert = await screen.findByRole('alert', undefined, slow);
    expect(alert).toHaveTextContent('Could not cancel the scan');
    expect(alert).toHaveTextContent('only queued or running scans can be cancelled');
    expect(requests.filter((r) => r.method === 'POST').map((r) => r.url.pathname)).toEqual(['/api/scans/42/cancel']);
  });

  it('gives a viewer nothing to change and says so', async () => {
    api(viewer, scanDetail({ status: 'running', finishedAt: null }));
    renderApp('/scans/42');

    expect(await screen.findByText(/As a viewer of Plateau Lab you cannot start a new scan from it/, undefined, slow)).toHaveTextContent('cancel it (its owner or a lead)');
    expect(screen.queryByRole('button', { name: 'Cancel scan' })).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Clone scan' })).not.toBeInTheDocument();
  });

  it('queues the failed points again for the owner and shows the scan running', async () => {
    let detail = scanDetail({ failedPoints: 2, donePoints: 7 });
    api(memberUser, undefined, {
      'GET /api/scans/42': () => json(200, detail),
      'POST /api/scans/42/retry': () => {
        detail = { ...detail, status: 'running', failedPoints: 0, finishedAt: null };
        return json(200, detail);
      },
    });
    const { user } = renderApp('/scans/42');

    await user.click(await screen.findByRole('button', { name: 'Retry failed points' }, slow));
    expect(await screen.findByText('Running', undefined, slow)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Cancel scan' })).toBeInTheDocument();
  });

  it('lets a lead delete the scan after confirming, then goes to the scans list', async () => {
    const { requests } = api(adminUser, scanDetail(), {
      'DELETE /api/scans/42': () => new Response(null, { status: 204 }),
      'GET /api/scans': () => json(200, { items: [], total: 0, page: 1, pageSize: 25 }),
    });
    const { user, router } = renderApp('/scans/42');

    await user.click(await screen.findByRole('button', { name: 'Delete scan' }, slow));
    const dialog = await screen.findByRole('alertdialog', undefined, slow);
    expect(dialog).toHaveTextContent('Delete “Natural inflation, f against N_*”?');
    expect(dialog).toHaveTextContent('all 9 of its points');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument(), slow);
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Delete scan' }));
    await user.click(within(await screen.findByRole('alertdialog', undefined, slow)).getByRole('button', { name: 'Delete scan and points' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans'), slow);
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.url.pathname)).toEqual(['/api/scans/42']);
  });

  it('offers a member to refine a completed grid, estimates the first level, and opens the level once launched', async () => {
    const { requests } = api(memberUser, scanDetail(), {
      'GET /api/scans/42/lineage': () => json(200, { parentScanId: null, level: null, levels: [] }),
      'GET /api/scans/42/refine/estimate': () => json(200, { level: 1, cells: 4, crossedCells: 2, points: 10, parentPoints: 9, pointsPerSecond: null, seconds: null, finestLengths: [9, 9] }),
      'POST /api/scans/42/refine': () => json(201, scanDetail({ id: 43 })),
      'GET /api/scans/43': () => json(200, scanDetail({ id: 43, name: 'level 1' })),
    });
    const { user, router } = renderApp('/scans/42');
    await user.click(await screen.findByRole('button', { name: 'Refine…' }, slow));
    expect(await screen.findByTestId('refine-estimate')).toHaveTextContent('Level 1: 10 points in 2 of 4 cells; the finest level has 9 × 9 nodes.');
    await user.click(screen.getByRole('button', { name: 'Launch refinement' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/43'));
    expect(requests.filter((r) => r.method === 'POST').map((r) => r.url.pathname)).toEqual(['/api/scans/42/refine']);
  });

  it('offers no refinement to a viewer', async () => {
    api(viewer, scanDetail());
    renderApp('/scans/42');
    expect(await screen.findByRole('heading', { level: 1 }, slow)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Refine…' })).not.toBeInTheDocument();
  });

  it('says so when the scan cannot be loaded', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/scans/42': () => apiError(404, 'No such scan') });
    renderApp('/scans/42');
    const alert = await screen.findByRole('alert', undefined, slow);
    expect(alert).toHaveTextContent('Could not load scan 42');
    expect(alert).toHaveTextContent('No such scan. It may have been removed');
  });
});

describe('scan heatmaps', () => {
  it('leaves the boundary lines until a live scan has finished, so its refreshes stay light', async () => {
    const { requests } = api(memberUser, scanDetail({ status: 'running', finishedAt: null }));
    renderApp('/scans/42');
    await screen.findByRole('img', { name: 'Heatmap of r over f and N_*' }, slow);
    expect(screen.getByText(/^Once the scan has finished, lines show the 68.3 %/)).toBeInTheDocument();
    expect(requests.some((r) => r.url.searchParams.get('output') === 'deltaChi2')).toBe(false);
    const contours = (plotIn(screen.getByRole('img', { name: 'Heatmap of r over f and N_*' })).data as { type: string }[]).filter((t) => t.type === 'contour');
    expect(contours).toHaveLength(0);
  });

  it('draws n_s and r side by side and the chosen output, with failures grouped by reason', async () => {
    const { requests } = api(memberUser);
    const { user, router } = renderApp('/scans/42');

    const ns = await screen.findByRole('img', { name: 'Heatmap of n_s over f and N_*' }, slow);
    expect(screen.getByRole('img', { name: 'Heatmap of r over f and N_*' })).toBeInTheDocument();
    expect(screen.getByRole('img', { name: 'Heatmap of α_s over f and N_*' })).toBeInTheDocument();
    const grids = requests.filter((r) => r.url.pathname === '/api/scans/42/grid').map((r) => Object.fromEntries(r.url.searchParams));
    expect(grids).toEqual(expect.arrayContaining(['ns', 'r', 'alphaS'].map((output) => ({ x: 'f', y: 'nStar', output, maxCells: '200' }))));

    // Failed cells carry no value; the legend counts them by reason, and missing cells apart.
    expect(screen.getByRole('region', { name: 'Failed and missing cells' })).toHaveTextContent('insufficient_efolds (2)');
    expect(screen.getByRole('region', { name: 'Failed and missing cells' })).toHaveTextContent('not stored yet (1)');
    await waitFor(() => expect(plotIn(ns).data[0]).toMatchObject({ type: 'heatmap' }), slow);
    expect((plotIn(ns).data[0] as { z: unknown }).z).toEqual(values.ns);
    expect(plotIn(ns).layout.annotations).toEqual([expect.objectContaining({ text: 'one point per cell' })]);
    expect(screen.getAllByText(/6 ok, 2 failed, 1 not stored yet$/)).toHaveLength(3);

    // The 68 and 95 % boundaries of the default set, as contour lines of its Δχ² over every panel.
    await waitFor(() => expect(grids.length).toBeGreaterThan(0));
    const asked = () => requests.filter((r) => r.url.searchParams.get('output') === 'deltaChi2').map((r) => r.url.searchParams.get('likelihood'));
    await waitFor(() => expect(asked()).toContain('planck18-bk18@1'), slow);
    const contours = () => (plotIn(screen.getByRole('img', { name: 'Heatmap of r over f and N_*' })).data as { type: string; z?: unknown; contours?: { start: number } }[]).filter((t) => t.type === 'contour');
    await waitFor(() => expect(contours()).toHaveLength(4), slow);
    expect(contours()[0].z).toEqual(values.deltaChi2);
    expect(contours().map((t) => t.contours!.start.toFixed(2))).toEqual(['2.30', '2.30', '6.18', '6.18']);
    expect(screen.getByText(/^Lines: the 68.3 % \(solid, Δχ² = 2.30\) and 95.4 % \(dashed, Δχ² = 6.18\) boundaries/)).toHaveTextContent('of Planck 2018 + BICEP/Keck 2018 for two parameters');
    expect(screen.getByText(/^An approximation of the published result/)).toBeInTheDocument();

    // Another set redraws the lines from its own Δχ².
    await user.selectOptions(screen.getByLabelText('Likelihood set'), 'pact-lb-bk18@1');
    await waitFor(() => expect(asked()).toContain('pact-lb-bk18@1'), slow);
    expect(router.state.location.search).toBe('?likelihood=pact-lb-bk18%401');
    await user.click(screen.getByRole('checkbox', { name: '68/95 % boundaries' }));
    await waitFor(() => expect(router.state.location.search).toContain('boundaries=off'), slow);
    await waitFor(() => expect(contours()).toHaveLength(0), slow);
    expect(screen.queryByText(/^Lines: the 68.3 %/)).not.toBeInTheDocument();

    await user.selectOptions(screen.getByLabelText('Third panel'), 'Status');
    expect(await screen.findByRole('heading', { name: 'Status of each point' }, slow)).toBeInTheDocument();
    expect(requests.some((r) => r.url.searchParams.get('output') === 'status')).toBe(true);
  });

  it("opens a clicked cell's point in a drawer with its numbers, a link to its page and its thread", async () => {
    const point5 = {
      pointIndex: 5, inputs: { f: 7, nStar: 60 }, status: 'ok', failureReason: null, ns: 0.967, r: 0.02, alphaS: -4e-4, As: 2.1e-9,
      amplitudeScale: 1, nTotal: 70, nStar: 60, phiStar: 3, phiEnd: 0.5, energyScaleGeV: 1e16,
    };
    const note = {
      id: 77, scanId: 42, pointIndex: 5, body: 'Check this one against the exact method.', createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z',
      edited: false, mentions: [], author: { id: 1, displayName: 'Amara Okafor', handle: 'amara.okafor' },
    };
    const { requests } = api(memberUser, scanDetail(), {
      'GET /api/scans/42/comments/counts': () => json(200, { scan: 0, points: { '5': 2, '0': 1 } }),
      'GET /api/scans/42/comments': (request) => json(200, request.url.searchParams.get('pointIndex') === '5' ? [note, { ...note, id: 78, body: 'Agreed.' }] : []),
      'GET /api/scans/42/points/5': () => json(200, point5),
    });
    const { user, router } = renderApp('/scans/42');
    const ns = await screen.findByRole('img', { name: 'Heatmap of n_s over f and N_*' }, slow);
    // Points 5 (ix 1, iy 2) and 0 (ix 0, iy 0) have comments: a dot on each of their cells.
    await waitFor(() => expect(plotIn(ns).data.find((trace) => trace.name === 'has comments')).toMatchObject({ x: [0, 1], y: [0, 2] }), slow);

    // Cell (ix 1, iy 2) is f = 7, N_* = 60: point 1 × 3 + 2.
    act(() => plotIn(ns).onClick!({ points: [{ x: 1, y: 2, curveNumber: 0 }] }));
    const drawer = await screen.findByRole('dialog', { name: /^Point 5/ }, slow);
    expect(router.state.location.pathname).toBe('/scans/42');
    expect(router.state.location.search).toBe('?point=5');
    expect(within(drawer).getByRole('heading', { name: 'Point 5 · 2 comments' })).toBeInTheDocument();
    const numbers = within(drawer).getByLabelText('Point 5 in numbers');
    await waitFor(() => expect(numbers).toHaveTextContent('n_s0.967'), slow);
    expect(numbers).toHaveTextContent('f7');
    expect(within(drawer).getByRole('link', { name: 'Open point' })).toHaveAttribute('href', '/scans/42/points/5');

    const thread = within(drawer).getByRole('region', { name: 'Discussion of this point' });
    expect(await within(thread).findByText('Check this one against the exact method.', undefined, slow)).toBeInTheDocument();
    expect(within(thread).getByText('Agreed.')).toBeInTheDocument();
    expect(requests.filter((r) => r.url.pathname === '/api/scans/42/comments').map((r) => r.url.searchParams.get('pointIndex'))).toEqual(['5']);

    await user.click(within(drawer).getByRole('button', { name: 'Close the point' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument(), slow);
    expect(router.state.location.search).toBe('');
  });

  it('goes from the drawer to the point page', async () => {
    api(memberUser, scanDetail(), {
      'GET /api/scans/42/comments': () => json(200, []),
      'GET /api/scans/42/points/5': () => apiError(404, 'Point 5 is not stored yet'),
    });
    const { user, router } = renderApp('/scans/42?point=5');
    const drawer = await screen.findByRole('dialog', { name: /^Point 5/ }, slow);
    await waitFor(() => expect(within(drawer).getByLabelText('Point 5 in numbers')).toHaveTextContent('Statusnot stored yet'), slow);
    await user.click(within(drawer).getByRole('link', { name: 'Open point' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/42/points/5'), slow);
  });

  it('swaps the axes and holds a third axis with a slider that keyboards can move', async () => {
    const spec = { ...naturalSpec, axes: [...naturalSpec.axes!, { kind: 'list' as const, parameter: 'Lambda', values: [1e-3, 5e-3, 1e-2] }], params: {} };
    const { requests } = api(memberUser, scanDetail({}, spec), {
      'GET /api/scans/42/grid': (request) => {
        const at = Number(request.url.searchParams.get('at.Lambda') ?? 0);
        const output = (request.url.searchParams.get('output') ?? 'ns') as ScanGridSlice['output'];
        // With x = N_* the slice is the transpose.
        const swapped = request.url.searchParams.get('x') === 'nStar';
        const flip = <T,>(rows: T[][]) => rows[0].map((_, i) => rows.map((row) => row[i]));
        const cutAt = { at: { Lambda: { index: at, value: [1e-3, 5e-3, 1e-2][at] } } };
        return json(200, swapped
          ? slice(output, flip(values[output]), flip(status), { x: axes.y, y: axes.x, ...cutAt })
          : slice(output, values[output], status, { ...axes, ...cutAt }));
      },
    });
    const { user, router } = renderApp('/scans/42');

    const slider = await screen.findByRole('slider', { name: 'Lambda' }, slow);
    expect(slider).toHaveAttribute('aria-valuetext', '0.005 (value 2 of 3)');
    expect(requests.find((r) => r.url.pathname.endsWith('/grid'))?.url.searchParams.get('at.Lambda')).toBe('1');
    act(() => slider.focus());
    await user.keyboard('{ArrowRight}');
    await waitFor(() => expect(router.state.location.search).toBe('?at.Lambda=2'), slow);
    await waitFor(() => expect(requests.some((r) => r.url.searchParams.get('at.Lambda') === '2')).toBe(true), slow);

    await user.click(screen.getByRole('button', { name: 'Swap axes' }));
    await waitFor(() => expect(router.state.location.search).toContain('x=nStar&y=f'), slow);
    expect(await screen.findByRole('img', { name: 'Heatmap of n_s over N_* and f' }, slow)).toBeInTheDocument();
  });

  it('zooms into a dragged window at finer resolution, says what a cell stands for, and returns on double-click', async () => {
    // The whole 3 × 3 slice in blocks of 2 × 2 points, as the API aggregates it past maxCells.
    const blocked = (output: ScanGridSlice['output']): ScanGridSlice => ({
      x: { parameter: 'f', length: 3, from: 0, to: 2, block: 2, values: [5, 10] },
      y: { parameter: 'nStar', length: 3, from: 0, to: 2, block: 2, values: [50, 60] },
      output, at: {},
      ...(output === 'status' ? {} : { mean: [0.96, null, 0.9665, null], min: [0.955, null, 0.966, null], max: [0.9649, null, 0.967, null] }),
      ok: [4, 0, 2, 0],
      failed: { insufficient_efolds: [0, 2, 0, 0] },
    });
    const { requests } = api(memberUser, scanDetail(), {
      'GET /api/scans/42/grid': (request) => {
        const query = request.url.searchParams;
        const output = (query.get('output') ?? 'ns') as ScanGridSlice['output'];
        if (query.get('xFrom') === null) return json(200, blocked(output));
        // The window f index 2 × N_* indices 0–1 at one point per cell.
        const window = slice(output, [[values[output][0][2]], [values[output][1][2]]], [[status[0][2]], [status[1][2]]]);
        return json(200, { ...window, x: { ...window.x, parameter: 'f', length: 3, from: 2, to: 2, values: [10] }, y: { ...window.y, parameter: 'nStar', length: 3, from: 0, to: 1, values: [50, 55] } });
      },
    });
    const { router } = renderApp('/scans/42');

    const ns = await screen.findByRole('img', { name: 'Heatmap of n_s over f and N_*' }, slow);
    await waitFor(() => expect(screen.getAllByText(/Cells: blocks of 2 × 2 points: mean\./)).toHaveLength(3), slow);
    await waitFor(() => expect(plotIn(ns).layout.annotations).toEqual([expect.objectContaining({ text: 'blocks of 2 × 2 points: mean' })]), slow);
    expect((plotIn(ns).data[0] as { z: unknown }).z).toEqual([[0.96, null], [0.9665, null]]);
    // Failures count points, not cells: the block of f = 10 holds two.
    expect(screen.getByRole('region', { name: 'Failed and missing cells' })).toHaveTextContent('insufficient_efolds (2)');

    // A drag over the second column and the first row: f index 2, N_* indices 0 and 1.
    act(() => plotIn(ns).onRelayout!({ 'xaxis.range[0]': 0.6, 'xaxis.range[1]': 1.4, 'yaxis.range[0]': -0.4, 'yaxis.range[1]': 0.3 }));
    await waitFor(() => expect(router.state.location.search).toBe('?xFrom=2&xTo=2&yFrom=0&yTo=1'), slow);
    await waitFor(() => expect(screen.getAllByText(/^Zoomed in \(double-click to return\); Cells: one point per cell\./)).toHaveLength(3), slow);
    const zoomed = requests.filter((r) => r.url.searchParams.get('xFrom') === '2').map((r) => Object.fromEntries(r.url.searchParams));
    expect(zoomed).toEqual(expect.arrayContaining([{ x: 'f', y: 'nStar', output: 'ns', maxCells: '200', xFrom: '2', xTo: '2', yFrom: '0', yTo: '1' }]));
    await waitFor(() => expect((plotIn(ns).data[0] as { z: unknown }).z).toEqual([[null], [null]]), slow);

    act(() => plotIn(ns).onRelayout!({ 'xaxis.autorange': true, 'yaxis.autorange': true }));
    await waitFor(() => expect(router.state.location.search).toBe(''), slow);
    await waitFor(() => expect(screen.getAllByText(/Cells: blocks of 2 × 2 points: mean\./)).toHaveLength(3), slow);
  });

  it('shows the n_s map full width on demand, asking for the finest cells', async () => {
    const { requests } = api(memberUser);
    const { user, router } = renderApp('/scans/42');
    await screen.findByRole('img', { name: 'Heatmap of n_s over f and N_*' }, slow);
    await user.click(screen.getByRole('button', { name: 'Full width' }));
    await waitFor(() => expect(router.state.location.search).toBe('?wide=on'), slow);
    await waitFor(() => expect(requests.some((r) => r.url.searchParams.get('maxCells') === '512')).toBe(true), slow);
    expect(await screen.findByRole('button', { name: 'Back to three across' }, slow)).toHaveAttribute('aria-pressed', 'true');
  });

  it('fills in while the scan runs, at fewer cells per panel', async () => {
    let calls = 0;
    const { requests } = api(memberUser, scanDetail({ status: 'running', finishedAt: null }), {
      'GET /api/scans/42/grid': (request) => {
        const output = request.url.searchParams.get('output') ?? 'ns';
        if (output === 'ns') calls++;
        const stored = calls > 1 ? status : status.map((row) => row.map(() => null));
        return json(200, slice(output as ScanGridSlice['output'], values[output], stored, axes));
      },
    });
    renderApp('/scans/42');

    expect(await screen.findAllByText(/ 0 ok, 0 failed, 9 not stored yet$/)).toHaveLength(3);
    await waitFor(() => expect(screen.getAllByText(/6 ok, 2 failed, 1 not stored yet$/)).toHaveLength(3), { timeout: 8_000 });
    const cells = requests.filter((r) => r.url.pathname.endsWith('/grid')).map((r) => r.url.searchParams.get('maxCells'));
    expect(new Set(cells)).toEqual(new Set(['100']));
  });

  it('draws a one-axis scan as lines against its axis', async () => {
    const spec = { ...naturalSpec, axes: [naturalSpec.axes![1]], params: { Lambda: 5e-3, f: 7 } };
    const point = (pointIndex: number, nStar: number, ok = true) => ({
      pointIndex, inputs: { nStar }, status: ok ? 'ok' : 'no_end', failureReason: ok ? null : 'inflation never ends',
      ns: ok ? 0.96 : null, r: ok ? 0.05 : null, alphaS: null, As: null, amplitudeScale: null, nTotal: null, nStar, phiStar: null, phiEnd: null, energyScaleGeV: null,
    });
    const { requests } = api(memberUser, scanDetail({}, spec), {
      'GET /api/scans/42/points': () => json(200, { items: [point(0, 50), point(1, 55, false), point(2, 60)], total: 3, page: 1, pageSize: 1000 }),
    });
    renderApp('/scans/42');

    expect(await screen.findByRole('tab', { name: 'Line plots' }, slow)).toHaveAttribute('aria-selected', 'true');
    const ns = await screen.findByRole('img', { name: 'Line plot of n_s against N_*' }, slow);
    await waitFor(() => expect(plotIn(ns).data[0]).toMatchObject({ x: [50, 60], y: [0.96, 0.96] }), slow);
    expect(plotIn(ns).layout.shapes).toHaveLength(1);
    expect(screen.getByRole('region', { name: 'Failed and missing cells' })).toHaveTextContent('no_end (1)');
    expect(requests.some((r) => r.url.pathname.endsWith('/grid'))).toBe(false);
  });

  it('opens a clicked line point in the drawer too', async () => {
    const spec = { ...naturalSpec, axes: [naturalSpec.axes![1]], params: { Lambda: 5e-3, f: 7 } };
    const point = (pointIndex: number, nStar: number) => ({
      pointIndex, inputs: { nStar }, status: 'ok', failureReason: null,
      ns: 0.96, r: 0.05, alphaS: null, As: null, amplitudeScale: null, nTotal: null, nStar, phiStar: null, phiEnd: null, energyScaleGeV: null,
    });
    api(memberUser, scanDetail({}, spec), {
      'GET /api/scans/42/points': () => json(200, { items: [point(0, 50), point(1, 55), point(2, 60)], total: 3, page: 1, pageSize: 1000 }),
      'GET /api/scans/42/points/2': () => json(200, point(2, 60)),
      'GET /api/scans/42/comments/counts': () => json(200, { scan: 0, points: { '2': 1 } }),
      'GET /api/scans/42/comments': () => json(200, []),
    });
    const { router } = renderApp('/scans/42');
    const ns = await screen.findByRole('img', { name: 'Line plot of n_s against N_*' }, slow);
    await waitFor(() => expect(plotIn(ns).onClick).toBeDefined(), slow);
    act(() => plotIn(ns).onClick!({ points: [{ customdata: 2, curveNumber: 0 }] }));
    const drawer = await screen.findByRole('dialog', { name: /^Point 2/ }, slow);
    expect(router.state.location.search).toBe('?point=2');
    await waitFor(() => expect(within(drawer).getByRole('heading', { name: 'Point 2 · 1 comment' })).toBeInTheDocument(), slow);
    expect(within(drawer).getByRole('region', { name: 'Discussion of this point' })).toBeInTheDocument();
  });
});

describe('scan discussion', () => {
  it("shows the scan's own thread as a tab with its count, and posts to it", async () => {
    const group = {
      id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: '', myRole: 'member', memberCount: 2, pointLimit: 1_000_000,
      members: [
        { userId: 1, displayName: 'Amara Okafor', email: 'amara.okafor@halvorsen.example', role: 'lead' },
        { userId: 2, displayName: 'Tomas Lindqvist', email: 'tomas.lindqvist@halvorsen.example', role: 'member' },
      ],
    };
    const stored: unknown[] = [];
    const { requests } = api(memberUser, scanDetail(), {
      'GET /api/groups/10': () => json(200, group),
      'GET /api/scans/42/comments/counts': () => json(200, { scan: stored.length + 3, points: {} }),
      'GET /api/scans/42/comments': () => json(200, stored),
      'POST /api/scans/42/comments': (request) => {
        const { body } = request.body as { body: string };
        const created = {
          id: 5, scanId: 42, pointIndex: null, body, createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z', edited: false,
          mentions: [{ id: 1, displayName: 'Amara Okafor', handle: 'amara.okafor' }], author: { id: 2, displayName: 'Tomas Lindqvist', handle: 'tomas.lindqvist' },
        };
        stored.push(created);
        return json(201, created);
      },
    });
    const { user, router } = renderApp('/scans/42');

    const tab = await screen.findByRole('tab', { name: /^Discussion/ }, slow);
    await waitFor(() => expect(tab).toHaveAccessibleName('Discussion 3 comments'), slow);
    await user.click(tab);
    await waitFor(() => expect(router.state.location.search).toBe('?view=discussion'), slow);
    const thread = await screen.findByRole('region', { name: 'Discussion' }, slow);
    expect(await within(thread).findByText('No comments yet on this scan. Start the discussion below.', undefined, slow)).toBeInTheDocument();

    const box = within(thread).getByRole('textbox', { name: 'Add a comment' });
    await user.type(box, 'Over to @am');
    await user.click(await within(thread).findByRole('option', { name: /Amara Okafor/ }, slow));
    await user.type(box, 'for the exact run');
    await user.click(within(thread).getByRole('button', { name: 'Post comment' }));

    expect(await within(thread).findByText('@amara.okafor', undefined, slow)).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ body: 'Over to @amara.okafor for the exact run', pointIndex: null });
    await waitFor(() => expect(tab).toHaveAccessibleName('Discussion 4 comments'), slow);
  });
});

describe('scan over a list of points', () => {
  const { axes: _, ...settings } = naturalSpec;
  const listSpec = { ...settings, name: 'Natural inflation, picked points', pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 55], [10, 60]] } };
  const plane = {
    okPoints: 3, stride: 1, axisStrides: [1, 1], parameters: ['f', 'nStar'], pointIndex: [0, 1, 2], ns: [0.955, 0.961, 0.966], r: [0.09, 0.05, 0.02], alphaS: [-7e-4, -6e-4, -5e-4],
    nStar: [50, 55, 60], inputs: { f: [5, 7.5, 10], nStar: [50, 55, 60] },
  };
  const stored = (pointIndex: number, f: number, nStar: number) => ({
    pointIndex, inputs: { f, nStar }, status: 'ok', failureReason: null, ns: 0.96, r: 0.05, alphaS: -6e-4, As: 2.1e-9, amplitudeScale: 1,
    nTotal: 70, nStar, phiStar: 1, phiEnd: 2, energyScaleGeV: 1e16,
  });

  it('opens on the plane, offers the points table instead of heatmaps, and never asks for a grid slice', async () => {
    const { requests } = api(memberUser, scanDetail({}, listSpec), {
      'GET /api/scans/42/plane': () => json(200, plane),
      'GET /api/scans/42/points': () => json(200, { items: [stored(0, 5, 50), stored(1, 7.5, 55), stored(2, 10, 60)], total: 3, page: 1, pageSize: 50 }),
    });
    const { user } = renderApp('/scans/42');

    expect(await screen.findByRole('tab', { name: 'n_s–r plane' }, slow)).toHaveAttribute('aria-selected', 'true');
    expect(screen.queryByRole('tab', { name: /Heatmaps|Line plots/ })).not.toBeInTheDocument();
    expect(await screen.findByRole('img', { name: /^n_s–r plane of Natural inflation, picked points/ }, slow)).toBeInTheDocument();
    const settingsRegion = screen.getByRole('region', { name: 'Settings' });
    expect(within(settingsRegion).getByText('3 from a file, columns f, N_*')).toBeInTheDocument();
    expect(within(settingsRegion).queryByRole('table', { name: 'Scan axes' })).not.toBeInTheDocument();

    await user.click(screen.getByRole('tab', { name: 'Points' }));
    const table = await screen.findByRole('table', { name: 'Points of the scan' }, slow);
    expect(within(table).getByRole('button', { name: 'Sort by f' })).toBeInTheDocument();
    await waitFor(() => expect(within(table).getAllByRole('row')).toHaveLength(4), slow);
    expect(within(table).getAllByRole('row')[2]).toHaveTextContent('7.5');
    expect(requests.some((r) => r.url.pathname.endsWith('/grid'))).toBe(false);
  });
});

describe('scan n_s–r plane', () => {
  const plane = {
    okPoints: 12_000, stride: 3, axisStrides: [3, 1], parameters: ['f', 'nStar'], pointIndex: [0, 4], ns: [0.958, 0.9649], r: [0.05, 0.03], alphaS: [-6e-4, -5e-4], nStar: [50, 55],
    inputs: { f: [5, 7], nStar: [50, 55] },
  };

  it('opens as a tab, plots the ok points over the chosen set’s regions and says when they are sampled', async () => {
    const { requests } = api(memberUser, scanDetail(), { 'GET /api/scans/42/plane': () => json(200, plane) });
    const { user, router } = renderApp('/scans/42');

    await user.click(await screen.findByRole('tab', { name: 'n_s–r plane' }, slow));
    await waitFor(() => expect(router.state.location.search).toBe('?view=plane'), slow);
    const chart = await screen.findByRole('img', { name: 'n_s–r plane of Natural inflation, f against N_* with the regions of Planck 2018 + BICEP/Keck 2018' }, slow);
    expect(requests.find((r) => r.url.pathname === '/api/scans/42/plane')?.url.searchParams.get('limit')).toBe('5000');
    expect(screen.getByText(/sampled evenly, 1 in 3 of its points \(steps of 3 × 1 along f × nStar\): 2 of its 12,000 ok points shown/)).toBeInTheDocument();
    expect(screen.getByText(/^Shaded: the joint \(n_s, r\) regions of the set, Δχ² ≤ 2.30 \(68.3 %\) and 6.18 \(95.4 %\)/)).toHaveTextContent('r at k = 0.05 Mpc⁻¹');
    const regionNames = () => (plotIn(chart).data as { name: string; fill?: string }[]).filter((t) => t.fill === 'toself').map((t) => t.name);
    expect(regionNames()).toEqual(['Planck 2018 + BICEP/Keck 2018: 95.4 % (Δχ² ≤ 6.18)', 'Planck 2018 + BICEP/Keck 2018: 68.3 % (Δχ² ≤ 2.30)']);
    expect(screen.getByRole('link', { name: 'arXiv:2110.00483' })).toBeInTheDocument();

    await user.selectOptions(screen.getByLabelText('Likelihood set'), 'pact-lb-bk18@1');
    await waitFor(() => expect(regionNames()[0]).toBe('P-ACT-LB + BICEP/Keck 2018: 95.4 % (Δχ² ≤ 6.18)'), slow);
    expect(screen.getByRole('link', { name: 'arXiv:2503.14452' })).toBeInTheDocument();
    await user.click(screen.getByRole('radio', { name: 'Log' }));
    await waitFor(() => expect(plotIn(screen.getByRole('img', { name: /n_s–r plane/ })).layout.yaxis?.type).toBe('log'), slow);
    await user.selectOptions(screen.getByLabelText('Colour by'), 'N_*');
    expect(router.state.location.search).toContain('color=nStar');

    act(() => plotIn(chart).onClick!({ points: [{ customdata: [0, 4], curveNumber: 9 }] }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/42/points/4'), slow);
  });

  it('draws the group’s constraint regions until switched off, and links to where they are uploaded', async () => {
    const survey: ConstraintRegion = {
      id: 1, groupId: 10, name: 'Survey A', source: 'Invented survey DR2', confidenceLevel: 0.95,
      vertices: [{ ns: 0.955, r: 0 }, { ns: 0.975, r: 0 }, { ns: 0.965, r: 0.04 }], createdById: 2, createdAt: '2026-12-01T10:00:00.000Z',
    };
    api(memberUser, scanDetail(), {
      'GET /api/scans/42/plane': () => json(200, plane),
      'GET /api/constraint-regions': () => json(200, [survey]),
    });
    const { user } = renderApp('/scans/42?view=plane');
    const chart = await screen.findByRole('img', { name: /^n_s–r plane of/ }, slow);
    const names = () => plotIn(chart).data.map((trace) => trace.name);

    await waitFor(() => expect(names()).toContain('Survey A (95% CL, Invented survey DR2)'), slow);
    await user.click(screen.getByRole('checkbox', { name: 'Survey A (95% CL, Invented survey DR2)' }));
    await waitFor(() => expect(names()).not.toContain('Survey A (95% CL, Invented survey DR2)'), slow);
    expect(screen.getByRole('link', { name: 'group page' })).toHaveAttribute('href', '/groups/10');
  });

  it('explains an empty plane', async () => {
    api(memberUser, scanDetail(), { 'GET /api/scans/42/plane': () => json(200, { ...plane, okPoints: 0, stride: 1, pointIndex: [], ns: [], r: [], alphaS: [], nStar: [], inputs: { f: [], nStar: [] } }) });
    renderApp('/scans/42?view=plane');
    expect(await screen.findByText('No ok points yet', undefined, slow)).toBeInTheDocument();
  });
});
