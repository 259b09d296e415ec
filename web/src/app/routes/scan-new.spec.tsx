import { screen, waitFor, within } from '@testing-library/react';
import { createScanSchema, type CreateScan, type CurrentUser, type PotentialModel, type ScanDetail, type StoredScanSpec, type WorkerPool } from '@sixtyfold/shared';
import { adminUser, memberUser, scan } from '@/testing/fixtures';
import { apiError, json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
// Imported for its options argument (the global type is shadowed by @types/jest from the API workspace).
import { describe } from 'vitest';

const bumpModel: PotentialModel = {
  id: 7,
  groupId: 10,
  name: 'Plateau with a bump',
  expression: 'V0 * (1 - exp(-sqrt(2/3) * phi))^2 * (1 + A * exp(-(phi - phi0)^2 / (2 * sigma^2)))',
  parameters: [
    { name: 'V0', defaultValue: 1e-10, min: 1e-14, max: 1e-8, description: 'overall scale' },
    { name: 'A', defaultValue: 0.001, min: 0, max: 0.05, description: 'height of the bump' },
    { name: 'phi0', defaultValue: 5, min: 3, max: 7, description: 'position of the bump' },
    { name: 'sigma', defaultValue: 0.1, min: 0.01, max: 1, description: 'width of the bump' },
  ],
  phiInit: 7.5,
  description: '',
  createdById: 2,
  createdAt: '2026-11-01T08:00:00.000Z',
  updatedAt: '2026-11-01T08:00:00.000Z',
};
const otherGroupModel: PotentialModel = { ...bumpModel, id: 8, groupId: 11, name: 'Log-corrected quadratic' };

const pool = (concurrencies: number[]): WorkerPool => ({
  workers: concurrencies.map((concurrency, i) => ({
    id: `calc-0${i}:${100 + i}`,
    host: `calc-0${i}`,
    pid: 100 + i,
    concurrency,
    startedAt: '2026-11-30T08:00:00.000Z',
    lastSeenAt: new Date().toISOString(),
    chunksDone: 0,
    pointsDone: 0,
  })),
  queue: { waiting: 0, active: 0, delayed: 0, failed: 0 },
});

/** What the API answers to a posted spec: it stored it, with its potential frozen (here: a family, so its key). */
function created(body: unknown): ScanDetail {
  const posted = body as CreateScan;
  const spec: StoredScanSpec = { ...posted, potentialSource: posted.model.kind === 'family' ? posted.model.family : 'phi^2' };
  return { ...scan({ id: 321, name: spec.name, status: 'queued', donePoints: 0 }), note: '', spec, startedAt: null, progress: { total: 10, done: 0, failed: 0, running: 0, queued: 10, elapsedSeconds: null, remainingSeconds: null } };
}

function mockForm(overrides: Record<string, (request: MockRequest) => Response> = {}, user: CurrentUser = memberUser) {
  return mockApi({
    'GET /api/auth/me': () => json(200, user),
    'GET /api/models': () => json(200, [bumpModel, otherGroupModel]),
    'GET /api/workers/pool': () => json(200, pool([4, 4])),
    'POST /api/scans': (request) => json(201, created(request.body)),
    'GET /api/scans/321': (request) => json(200, created({ name: 'launched', ...(request.body as object) })),
    ...overrides,
  });
}

/** The form loads with its page (a lazy chunk), which takes a moment on a busy test machine. */
const formReady = () => screen.findByRole('button', { name: 'Launch scan' }, { timeout: 10_000 });

const posts = (requests: MockRequest[]) => requests.filter((r) => r.method === 'POST' && r.url.pathname === '/api/scans');

// Typing re-validates the whole form, and timing points runs the engine on this thread here: allow time.
describe('New scan page', { timeout: 30_000 }, () => {
  it('counts the points of the grid as the axes change', async () => {
    mockForm();
    const { user } = renderApp('/scans/new');
    await formReady();

    expect(await screen.findByRole('heading', { name: 'New scan', level: 1 })).toBeInTheDocument();
    expect(await screen.findByLabelText('Axis 1 parameter')).toHaveValue('p');
    expect(await screen.findByText('10 points')).toBeInTheDocument();

    await user.clear(screen.getByLabelText('Axis 1 count'));
    await user.type(screen.getByLabelText('Axis 1 count'), '25');
    expect(await screen.findByText('25 points')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Add axis' }));
    expect(screen.getByLabelText('Axis 2 parameter')).toHaveValue('lambda');
    expect(await screen.findByText('250 points')).toBeInTheDocument();
    // lambda is on an axis now, so it is no longer a fixed value.
    expect(screen.queryByLabelText('lambda')).not.toBeInTheDocument();

    await user.selectOptions(screen.getByLabelText('Axis 2 kind'), 'list');
    await user.type(screen.getByLabelText('Axis 2 values'), '1e-10, 2e-10\n4e-10');
    expect(await screen.findByText('75 points')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Remove axis 2' }));
    expect(await screen.findByText('25 points')).toBeInTheDocument();
    expect(screen.getByLabelText('lambda')).toHaveValue(1e-10);
  });

  it('refuses a logarithmic axis that starts at zero, with the schema’s message, and sends nothing', async () => {
    const { requests } = mockForm();
    const { user } = renderApp('/scans/new');
    await formReady();

    await user.type(await screen.findByLabelText('Name'), 'Monomial powers');
    await user.selectOptions(screen.getByLabelText('Axis 1 spacing'), 'log');
    await user.clear(screen.getByLabelText('Axis 1 min'));
    await user.type(screen.getByLabelText('Axis 1 min'), '0');
    await user.click(screen.getByRole('button', { name: 'Launch scan' }));

    expect(await screen.findByText('a logarithmic axis needs min > 0')).toBeInTheDocument();
    expect(screen.getByLabelText('Axis 1 min')).toHaveAttribute('aria-invalid', 'true');
    expect(posts(requests)).toHaveLength(0);
  });

  it('shows the schema’s message for an empty number, and names a word in a pasted list', async () => {
    const { requests } = mockForm();
    const { user } = renderApp('/scans/new');
    await formReady();

    await user.type(await screen.findByLabelText('Name'), 'Monomial powers');
    await user.clear(screen.getByLabelText('N_*'));
    await user.selectOptions(screen.getByLabelText('Axis 1 kind'), 'list');
    await user.type(screen.getByLabelText('Axis 1 values'), '1, 2 three 4');
    await user.click(screen.getByRole('button', { name: 'Launch scan' }));

    expect(await screen.findByText('give N_* or put it on an axis')).toBeInTheDocument();
    expect(screen.getByText('“three” is not a number')).toBeInTheDocument();
    expect(posts(requests)).toHaveLength(0);
  });

  it('posts exactly the body the API validates, then opens the new scan', async () => {
    const { requests } = mockForm();
    const { user, router } = renderApp('/scans/new');
    await formReady();

    await user.type(await screen.findByLabelText('Name'), 'T-model α sweep');
    await user.type(screen.getByLabelText('Tags'), ' plateau,attractor , ');
    await user.type(screen.getByLabelText('Note'), 'α over four decades');
    await user.selectOptions(screen.getByLabelText('Model'), 'family:alpha-t');
    await user.selectOptions(screen.getByLabelText('Axis 1 parameter'), 'alpha');
    await user.clear(screen.getByLabelText('Axis 1 count'));
    await user.type(screen.getByLabelText('Axis 1 count'), '5');
    await user.clear(screen.getByLabelText('N_*'));
    await user.type(screen.getByLabelText('N_*'), '57');
    await user.type(screen.getByLabelText('Tolerance'), '1e-9');
    await user.click(screen.getByRole('button', { name: 'Launch scan' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/321'));
    const [post] = posts(requests);
    const expected = {
      groupId: 10,
      name: 'T-model α sweep',
      tags: ['plateau', 'attractor'],
      note: 'α over four decades',
      model: { kind: 'family', family: 'alpha-t' },
      params: { V0: 1e-10, n: 1 },
      axes: [{ kind: 'range', parameter: 'alpha', min: 0.01, max: 100, count: 5, spacing: 'log' }],
      pivot: { kind: 'fixed', nStar: 57 },
      method: 'slowroll',
      tolerance: 1e-9,
    };
    expect(post.body).toEqual(expected);
    // What the API's validation pipe would make of it: the same, so nothing is lost or added.
    expect(createScanSchema.parse(post.body)).toEqual(expected);
  });

  it('takes the points from a file instead: read here with its line on a refusal, then sent as multipart', async () => {
    const { requests } = mockForm({
      // The API reads the points file into the stored spec's point list (the three points of picked.csv below).
      'POST /api/scans/upload': (request) => json(201, created({
        ...JSON.parse(String((request.body as FormData).get('spec'))),
        pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 55], [10, 60]] },
      })),
    });
    const { user, router } = renderApp('/scans/new');
    await formReady();

    await user.type(await screen.findByLabelText('Name'), 'Natural inflation, picked points');
    await user.selectOptions(screen.getByLabelText('Model'), 'family:natural');
    await user.click(screen.getByRole('radio', { name: 'Points from a file' }));
    expect(screen.queryByLabelText('Axis 1 parameter')).not.toBeInTheDocument();
    const fileInput = screen.getByLabelText(/^Points file/);

    // Refused before anything is sent, with the line of the file.
    await user.upload(fileInput, new File(['f,nStar\n5,50\n7,fifty\n'], 'points.csv', { type: 'text/csv' }));
    expect(await screen.findByText("line 3: column nStar is not a finite number ('fifty')")).toBeInTheDocument();
    await user.upload(fileInput, new File(['# picked\nf,lambda\n5,1\n'], 'points.csv', { type: 'text/csv' }));
    expect(await screen.findByText(/^line 2: unknown column lambda; the columns can be Lambda, f, nStar/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Launch scan' }));
    expect(requests.filter((r) => r.method === 'POST')).toEqual([]);

    const good = new File(['f,nStar\n5,50\n7.5,55\n10,60\n'], 'picked.csv', { type: 'text/csv' });
    await user.upload(fileInput, good);
    expect(await screen.findByText('3 points from picked.csv, columns f, nStar')).toBeInTheDocument();
    expect(screen.getByText('3 points')).toBeInTheDocument();
    // f and N_* come from the file, so neither is asked for as a fixed value.
    expect(screen.queryByLabelText('f')).not.toBeInTheDocument();
    expect(screen.getByText('N_* varies from the points file.')).toBeInTheDocument();
    expect(await screen.findByText(/^Estimated run time: /, {}, { timeout: 5_000 })).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Launch scan' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/321'));
    expect(posts(requests)).toEqual([]);
    const [sent] = requests.filter((r) => r.url.pathname === '/api/scans/upload');
    const form = sent.body as FormData;
    expect(sent.headers.get('X-Sixtyfold-Request')).toBe('upload');
    expect((form.get('points') as File).name).toBe('picked.csv');
    const settings = JSON.parse(String(form.get('spec')));
    expect(settings).toEqual({
      groupId: 10, name: 'Natural inflation, picked points', tags: [], note: '', model: { kind: 'family', family: 'natural' },
      params: { Lambda: 5e-3 }, pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    // With the file's points it is exactly what the API validates.
    expect(createScanSchema.safeParse({ ...settings, pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 55], [10, 60]] } }).success).toBe(true);
  });

  it('frees what the file’s columns vary and fixes again, with its default, what they stop varying', async () => {
    mockForm();
    const { user } = renderApp('/scans/new');
    await formReady();
    await user.selectOptions(await screen.findByLabelText('Model'), 'family:natural');
    expect(screen.getByLabelText('Axis 1 parameter')).toHaveValue('f');
    await user.clear(screen.getByLabelText('Lambda'));
    await user.type(screen.getByLabelText('Lambda'), '0.01');

    await user.click(screen.getByRole('radio', { name: 'Points from a file' }));
    await user.upload(screen.getByLabelText(/^Points file/), new File(['Lambda,nStar\n0.005,50\n'], 'picked.csv', { type: 'text/csv' }));
    expect(await screen.findByText('1 points from picked.csv, columns Lambda, nStar')).toBeInTheDocument();
    // f left the varied inputs: fixed again at its default; Lambda and N_* come from the file.
    expect(screen.getByLabelText('f')).toHaveValue(7);
    expect(screen.queryByLabelText('Lambda')).not.toBeInTheDocument();

    await user.click(screen.getByRole('radio', { name: 'Grid' }));
    expect(screen.getByLabelText('Lambda')).toHaveValue(5e-3);
    expect(screen.getByLabelText('N_*')).toHaveValue(55);
    expect(screen.queryByLabelText('f')).not.toBeInTheDocument();
  });

  it('maps the server’s field errors back onto the form, with its message in an alert', async () => {
    const limit = 'This scan has 2,000,000 points, 1,000,000 more than Plateau Lab’s limit of 1,000,000';
    mockForm({
      'POST /api/scans': () =>
        apiError(400, `${limit}. params.lambda: lambda is out of range`, { axes: [limit], 'params.lambda': ['lambda is out of range'] }),
    });
    const { user, router } = renderApp('/scans/new');
    await formReady();

    await user.type(await screen.findByLabelText('Name'), 'Too big');
    await user.click(screen.getByRole('button', { name: 'Launch scan' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('The server refused this scan');
    expect(alert).toHaveTextContent(limit);
    expect(screen.getByText('lambda is out of range')).toBeInTheDocument();
    expect(screen.getByLabelText('lambda')).toHaveAttribute('aria-invalid', 'true');
    // The axes message sits with the axes as well as in the alert.
    expect(screen.getAllByText(limit, { exact: false })).toHaveLength(2);
    expect(router.state.location.pathname).toBe('/scans/new');
  });

  it('starts from a copy of an earlier scan with ?from=', async () => {
    const spec: StoredScanSpec = {
      groupId: 10,
      name: 'Bump position sweep',
      tags: ['bump', 'features'],
      note: 'Where does the bump stop mattering?',
      model: { kind: 'group', modelId: 7 },
      params: { V0: 1e-10, A: 0.002, sigma: 0.1 },
      phiInit: 7.5,
      axes: [{ kind: 'list', parameter: 'phi0', values: [4, 4.5, 5, 6] }],
      pivot: { kind: 'reheating', w: 0.25, energyGeV: 1e12 },
      method: 'exact',
      tolerance: 1e-10,
      potentialSource: bumpModel.expression,
    };
    const { requests } = mockForm({
      'GET /api/scans/55': () =>
        json(200, { ...scan({ id: 55, name: 'Bump position sweep', status: 'completed' }), note: spec.note, spec, startedAt: null, progress: { total: 4, done: 4, failed: 0, running: 0, queued: 0, elapsedSeconds: 3, remainingSeconds: 0 } }),
    });
    const { user } = renderApp('/scans/new?from=55');
    await formReady();

    expect(await screen.findByLabelText('Name')).toHaveValue('Copy of Bump position sweep');
    expect(screen.getByLabelText('Group')).toHaveValue('10');
    expect(screen.getByLabelText('Tags')).toHaveValue('bump, features');
    expect(screen.getByLabelText('Note')).toHaveValue('Where does the bump stop mattering?');
    expect(screen.getByLabelText('Model')).toHaveValue('group:7');
    expect(screen.getByLabelText('A')).toHaveValue(0.002);
    expect(screen.queryByLabelText('phi0')).not.toBeInTheDocument();
    expect(screen.getByLabelText('φ_init')).toHaveValue(7.5);
    expect(screen.getByLabelText('Axis 1 parameter')).toHaveValue('phi0');
    expect(screen.getByLabelText('Axis 1 kind')).toHaveValue('list');
    expect(screen.getByLabelText('Axis 1 values')).toHaveValue('4, 4.5, 5, 6');
    expect(screen.getByLabelText('Pivot')).toHaveValue('reheating');
    expect(screen.getByLabelText('w_reh')).toHaveValue(0.25);
    expect(screen.getByLabelText('ρ_reh^1/4 (GeV)')).toHaveValue(1e12);
    expect(screen.getByLabelText('Method')).toHaveValue('exact');
    expect(screen.getByLabelText('Tolerance')).toHaveValue(1e-10);
    expect(screen.getByText('4 points')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Launch scan' }));
    await waitFor(() => expect(posts(requests)).toHaveLength(1));
    const { potentialSource: _source, ...submitted } = spec;
    expect(posts(requests)[0].body).toEqual({ ...submitted, name: 'Copy of Bump position sweep' });
  });

  it('starts a copy of a list scan with the same points, sent again as a file', async () => {
    const spec: StoredScanSpec = {
      groupId: 10, name: 'Picked points', tags: [], note: '', model: { kind: 'family', family: 'natural' },
      params: { Lambda: 5e-3 }, pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.25, 55.125], [10, 60]] },
      pivot: { kind: 'fixed' }, method: 'slowroll', potentialSource: 'Lambda^4 * (1 + cos(phi / f))',
    };
    const { requests } = mockForm({
      'GET /api/scans/56': () =>
        json(200, { ...scan({ id: 56, name: 'Picked points', status: 'completed' }), note: '', spec, startedAt: null, progress: { total: 3, done: 3, failed: 0, running: 0, queued: 0, elapsedSeconds: 1, remainingSeconds: 0 } }),
      // The API reads the points file into the stored spec's point list (the three points of picked.csv below).
      'POST /api/scans/upload': (request) => json(201, created({
        ...JSON.parse(String((request.body as FormData).get('spec'))),
        pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 55], [10, 60]] },
      })),
    });
    const { user } = renderApp('/scans/new?from=56');
    await formReady();

    expect(await screen.findByText('3 points from points of Picked points.csv, columns f, nStar')).toBeInTheDocument();
    expect(screen.getByRole('radio', { name: 'Points from a file' })).toBeChecked();
    await user.click(screen.getByRole('button', { name: 'Launch scan' }));
    await waitFor(() => expect(requests.some((r) => r.url.pathname === '/api/scans/upload')).toBe(true));
    const form = requests.find((r) => r.url.pathname === '/api/scans/upload')!.body as FormData;
    expect(await (form.get('points') as File).text()).toBe('f,nStar\n5,50\n7.25,55.125\n10,60\n');
    expect(JSON.parse(String(form.get('spec')))).toMatchObject({ name: 'Copy of Picked points', params: { Lambda: 5e-3 } });
  });

  it('says when the scan to copy cannot be loaded, and offers a blank form', async () => {
    mockForm({ 'GET /api/scans/404': () => apiError(404, 'No such scan') });
    renderApp('/scans/new?from=404');

    expect(await screen.findByText('Could not load scan 404 to copy')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Start from a blank form' })).toHaveAttribute('href', '/scans/new');
  });

  it('offers group models of the chosen group only, prefilling their parameters and φ_init', async () => {
    mockForm();
    const { user } = renderApp('/scans/new');
    await formReady();

    const model = await screen.findByLabelText('Model');
    expect(within(model).queryByRole('option', { name: 'Log-corrected quadratic' })).not.toBeInTheDocument();
    await user.selectOptions(model, 'group:7');

    // The axis moves to a parameter of this model; the others are fixed at their defaults.
    expect(screen.getByLabelText('Axis 1 parameter')).toHaveValue('sigma');
    expect(screen.getByLabelText('Axis 1 spacing')).toHaveValue('linear');
    expect(screen.getByLabelText('V0')).toHaveValue(1e-10);
    expect(screen.getByLabelText('A')).toHaveValue(0.001);
    expect(screen.getByLabelText('phi0')).toHaveValue(5);
    expect(screen.queryByLabelText('sigma')).not.toBeInTheDocument();
    expect(screen.getByLabelText('φ_init')).toHaveValue(7.5);
  });

  it('lets a site administrator launch in any group', async () => {
    mockForm(
      {
        'GET /api/groups': () =>
          json(200, [
            { id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: '', myRole: 'lead', memberCount: 3 },
            { id: 12, slug: 'tensor-desk', name: 'Tensor Desk', description: '', myRole: null, memberCount: 2 },
          ]),
      },
      adminUser,
    );
    renderApp('/scans/new');
    await formReady();

    const group = await screen.findByLabelText('Group');
    expect(within(group).getAllByRole('option').map((o) => o.textContent)).toEqual(['Plateau Lab', 'Tensor Desk']);
  });

  it('tells a viewer that launching needs the member role', async () => {
    const viewer: CurrentUser = { ...memberUser, memberships: [{ ...memberUser.memberships[0], role: 'viewer' }] };
    mockForm({}, viewer);
    renderApp('/scans/new');

    expect(await screen.findByText('You cannot launch scans yet')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Launch scan' })).not.toBeInTheDocument();
  });

  it('estimates the run time from points timed in this browser, shared among the live workers', async () => {
    mockForm();
    const { user } = renderApp('/scans/new');
    await formReady();

    // No estimate while the form would be refused (it has no name yet).
    expect(await screen.findByText('The run time is estimated once every field is valid.')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Name'), 'Monomial powers');

    expect(await screen.findByText(/^Estimated run time: .+ on the 8 worker slots alive now\.$/, {}, { timeout: 5_000 })).toBeInTheDocument();
    expect(screen.getByText(/^Timed from 6 points of this grid in your browser \([\d.]+ ms each\), times 10 points, shared among 8 slots\./)).toBeInTheDocument();
  });

  it('says when no worker is alive to run the scan', async () => {
    mockForm({ 'GET /api/workers/pool': () => json(200, pool([])) });
    const { user } = renderApp('/scans/new');
    await formReady();

    await user.type(await screen.findByLabelText('Name'), 'Monomial powers');
    expect(await screen.findByText('No worker is alive', {}, { timeout: 5_000 })).toBeInTheDocument();
    expect(screen.getByText(/The scan will wait in the queue until a worker starts/)).toBeInTheDocument();
  });
});
