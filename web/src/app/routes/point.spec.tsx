import { pointRequest, RequestEvaluator, scanPoints, type ScanPointDto, type StoredScanSpec } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { plotIn } from '@/testing/plotly-chart-mock';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
import { scanDetail } from '@/testing/scan-fixtures';

vi.mock('@/components/plots/plotly-chart', () => import('@/testing/plotly-chart-mock'));
// The engine runs inline here (no Worker in happy-dom): allow it time on a busy machine.
vi.setConfig({ testTimeout: 30_000 });
const slow = { timeout: 15_000 };

const chaotic: StoredScanSpec = {
  groupId: 10,
  name: 'Chaotic inflation, p against N_*',
  tags: [],
  note: '',
  model: { kind: 'family', family: 'monomial' },
  params: { lambda: 1e-10 },
  phiInit: 16,
  axes: [
    { kind: 'list', parameter: 'p', values: [1, 2] },
    { kind: 'list', parameter: 'nStar', values: [50, 60] },
  ],
  pivot: { kind: 'fixed' },
  method: 'slowroll',
  potentialSource: 'monomial',
};

/** A point as the workers store it: the shared engine's result for that point of the grid or list. */
function storedPoint(spec: StoredScanSpec, index: number): ScanPointDto {
  const inputs = scanPoints(spec).point(index);
  const result = new RequestEvaluator().evaluate(pointRequest(spec, spec.potentialSource, inputs));
  const { status, message, ns, r, alphaS, As, amplitudeScale, nTotal, nStar, phiStar, phiEnd, energyScaleGeV } = result;
  return { pointIndex: index, inputs, status, failureReason: status === 'ok' ? null : message, ns, r, alphaS, As, amplitudeScale, nTotal, nStar, phiStar, phiEnd, energyScaleGeV };
}

function outputRow(name: string) {
  return screen.getAllByRole('row').find((row) => within(row).queryAllByRole('cell')[0]?.textContent === name)!;
}

describe('point page', () => {
  it('shows the inputs, and recomputes the stored outputs bit for bit with the trajectory', async () => {
    const stored = storedPoint(chaotic, 3);
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({}, chaotic)),
      'GET /api/scans/42/points/3': () => json(200, stored),
    });
    renderApp('/scans/42/points/3');

    expect(await screen.findByRole('heading', { level: 1, name: 'Point 3' }, slow)).toBeInTheDocument();
    const inputs = screen.getByRole('region', { name: 'Inputs' });
    expect(inputs).toHaveTextContent('p2axis value 2 of 2');
    expect(inputs).toHaveTextContent('N_*60axis value 2 of 2');
    expect(inputs).toHaveTextContent('lambda1.0000e-10fixed');
    expect(inputs).toHaveTextContent('φ_init16');

    // The same engine on the same JavaScript engine: every output agrees to the last bit, printed in full.
    await waitFor(() => expect(screen.getAllByText('identical')).toHaveLength(11), slow);
    expect(outputRow('n_s')).toHaveTextContent(`n_s${String(stored.ns)}${String(stored.ns)}identical`);

    const phi = screen.getByRole('img', { name: 'Trajectory plot of φ against N' });
    await waitFor(() => expect(plotIn(phi).data).toHaveLength(1), slow);
    const trace = plotIn(phi).data[0] as { x: number[]; y: number[] };
    expect(trace.x[0]).toBe(0);
    expect(trace.y[0]).toBe(16);
    expect(trace.x.at(-1)).toBeCloseTo(stored.nTotal!, 6);
    // The pivot is marked N_* = 60 e-folds before the end.
    expect(plotIn(phi).layout.shapes?.[0]).toMatchObject({ x0: stored.nTotal! - 60 });
    expect(screen.getByRole('img', { name: 'Trajectory plot of ε_H against N' })).toBeInTheDocument();

    expect(screen.getByRole('link', { name: 'Previous point' })).toHaveAttribute('href', '/scans/42/points/2');
    expect(screen.getByRole('button', { name: 'Next point' })).toBeDisabled();
    expect(screen.getByRole('link', { name: 'Back to the scan' })).toHaveAttribute('href', '/scans/42');
    expect(screen.queryByRole('button', { name: 'Compute the spectrum' })).not.toBeInTheDocument();
  });

  it('shows the inputs of a point from a list, and recomputes it bit for bit', async () => {
    const { axes: _, ...settings } = chaotic;
    const listed: StoredScanSpec = { ...settings, pointList: { columns: ['nStar', 'p'], rows: [[55, 2], [60, 1], [52, 2]] } };
    const stored = storedPoint(listed, 1);
    expect(stored.inputs).toEqual({ nStar: 60, p: 1 });
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({}, listed)),
      'GET /api/scans/42/points/1': () => json(200, stored),
    });
    renderApp('/scans/42/points/1');

    expect(await screen.findByRole('heading', { level: 1, name: 'Point 1' }, slow)).toBeInTheDocument();
    const inputs = screen.getByRole('region', { name: 'Inputs' });
    expect(inputs).toHaveTextContent('N_*60point 2 of 3 in the list');
    expect(inputs).toHaveTextContent('p1point 2 of 3 in the list');
    await waitFor(() => expect(screen.getAllByText('identical')).toHaveLength(11), slow);
    expect(screen.getByRole('link', { name: 'Next point' })).toHaveAttribute('href', '/scans/42/points/2');
  });

  it('tells rounding apart from a stored value that does not match what the engine gives now', async () => {
    const stored = storedPoint(chaotic, 0);
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({}, chaotic)),
      'GET /api/scans/42/points/0': () => json(200, { ...stored, r: stored.r! * (1 + 1e-3), alphaS: stored.alphaS! * (1 + 1e-12) }),
    });
    renderApp('/scans/42/points/0');

    await waitFor(() => expect(within(outputRow('r')).getByText('differs by 1.0e-3')).toBeInTheDocument(), slow);
    expect(within(outputRow('α_s')).getByText('rounding by 1.0e-12')).toBeInTheDocument();
    expect(within(outputRow('n_s')).getByText('identical')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Previous point' })).toBeDisabled();
    expect(screen.getByRole('link', { name: 'Next point' })).toHaveAttribute('href', '/scans/42/points/1');
  });

  it('shows a failed point with its reason, and a point not stored yet still recomputed', async () => {
    // φ² from φ_init = 16 has about 63.5 e-folds: enough for N_* = 60, not for a spec asking 90.
    const short = { ...chaotic, axes: [chaotic.axes![0], { kind: 'list' as const, parameter: 'nStar', values: [50, 90] }] };
    const failed = storedPoint(short, 3);
    expect(failed.status).toBe('insufficient_efolds');
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({ status: 'running', finishedAt: null }, short)),
      'GET /api/scans/42/points/3': () => json(200, failed),
      'GET /api/scans/42/points/2': () => apiError(404, 'point 2 is not stored yet'),
    });
    const { user } = renderApp('/scans/42/points/3');

    const outputs = await screen.findByRole('region', { name: 'Outputs' }, slow);
    expect(await within(outputs).findByText(/fewer than N_\* = 90/, undefined, slow)).toBeInTheDocument();
    await waitFor(() => expect(within(outputRow('Status')).getByText('identical')).toBeInTheDocument(), slow);
    expect(within(outputRow('n_s')).getByText('none in either')).toBeInTheDocument();

    await user.click(screen.getByRole('link', { name: 'Previous point' }));
    expect(await screen.findByText(/The workers have not stored this point yet/, undefined, slow)).toHaveTextContent('asks again every few seconds');
    await waitFor(() => expect(within(outputRow('n_s')).getAllByText(/^0\.9/)).toHaveLength(1), slow);
  });

  it('computes the spectrum near the pivot on request for the exact method', async () => {
    const exact: StoredScanSpec = {
      ...chaotic, name: 'Starobinsky, exact', model: { kind: 'family', family: 'starobinsky' }, potentialSource: 'starobinsky', params: {}, phiInit: undefined,
      axes: [{ kind: 'list', parameter: 'nStar', values: [55] }], method: 'exact',
    };
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({}, exact)),
      'GET /api/scans/42/points/0': () => json(200, storedPoint(exact, 0)),
    });
    const { user } = renderApp('/scans/42/points/0');

    await user.click(await screen.findByRole('button', { name: 'Compute the spectrum' }, slow));
    const chart = await screen.findByRole('img', { name: 'Spectrum plot of P_R and P_t against k' }, slow);
    await waitFor(() => expect(plotIn(chart).data).toHaveLength(2), slow);
    const [scalar, tensor] = plotIn(chart).data as { x: number[]; y: number[] }[];
    expect(scalar.x).toHaveLength(13);
    expect(scalar.x[6]).toBeCloseTo(0.05, 12);
    expect(tensor.y[6]).toBeLessThan(scalar.y[6]);
    expect(plotIn(chart).layout.shapes?.[0]).toMatchObject({ x0: 0.05 });
    expect(screen.getByRole('region', { name: 'Inputs' })).toHaveTextContent('the family’s start for these parameters');
  });

  it('compares a slow-roll point with the mode equations on request, output by output', async () => {
    const natural: StoredScanSpec = {
      ...chaotic, name: 'Natural, f = 3', model: { kind: 'family', family: 'natural' }, potentialSource: 'natural', params: { f: 3 }, phiInit: undefined,
      axes: [{ kind: 'list', parameter: 'nStar', values: [55] }], method: 'slowroll',
    };
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({}, natural)),
      'GET /api/scans/42/points/0': () => json(200, storedPoint(natural, 0)),
    });
    const { user } = renderApp('/scans/42/points/0');

    await user.click(await screen.findByRole('button', { name: 'Compare with the mode equations' }, slow));
    const table = await screen.findByRole('table', { name: 'Slow roll against the mode equations' }, slow);
    const engine = new RequestEvaluator();
    const request = pointRequest(natural, natural.potentialSource, scanPoints(natural).point(0));
    const slowRoll = engine.evaluate(request);
    const modes = engine.evaluate({ ...request, method: 'exact' });
    const rOff = (((slowRoll.r! - modes.r!) / modes.r!) * 100).toFixed(2);
    // Natural inflation with f = 3 is where first-order slow roll overestimates r by ~10 % (checked against an independent integration).
    expect(Number(rOff)).toBeGreaterThan(5);
    const rRow = within(table).getAllByRole('row').find((row) => within(row).queryAllByRole('cell')[0]?.textContent === 'r')!;
    expect(rRow).toHaveTextContent(`${rOff} %`);
  });

  it("carries the point's own thread, with the group's members to mention", async () => {
    const group = {
      id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: '', myRole: 'member', memberCount: 1, pointLimit: 1_000_000,
      members: [{ userId: 4, displayName: 'Tove Aalto', email: 'tove@halvorsen.example', role: 'viewer' }],
    };
    const note = {
      id: 31, scanId: 42, pointIndex: 3, body: 'Why does N_* = 60 end so late?', createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:05:00.000Z',
      edited: true, mentions: [], author: { id: 4, displayName: 'Tove Aalto', handle: 'tove' },
    };
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans/42': () => json(200, scanDetail({}, chaotic)),
      'GET /api/scans/42/points/3': () => json(200, storedPoint(chaotic, 3)),
      'GET /api/groups/10': () => json(200, group),
      'GET /api/scans/42/comments': () => json(200, [note]),
    });
    const { user } = renderApp('/scans/42/points/3');

    const thread = await screen.findByRole('region', { name: 'Discussion of this point' }, slow);
    const article = await within(thread).findByRole('article', { name: 'Comment by Tove Aalto' }, slow);
    expect(article).toHaveTextContent('Why does N_* = 60 end so late?');
    expect(within(article).getByText('edited')).toBeInTheDocument();
    expect(within(article).queryByRole('button', { name: 'Edit comment' })).not.toBeInTheDocument();
    expect(requests.find((r) => r.url.pathname === '/api/scans/42/comments')?.url.searchParams.get('pointIndex')).toBe('3');

    await user.type(within(thread).getByRole('textbox', { name: 'Add a comment' }), '@t');
    expect(await within(thread).findByRole('option', { name: 'Tove Aalto @tove' }, slow)).toBeInTheDocument();
  });

  it('says when the point is outside the grid', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/scans/42': () => json(200, scanDetail({}, chaotic)) });
    renderApp('/scans/42/points/4');
    expect(await screen.findByText('Point 4 is outside this scan', undefined, slow)).toBeInTheDocument();
    expect(screen.getByText(/has 4 points, numbered 0 to 3/)).toBeInTheDocument();
  });
});
