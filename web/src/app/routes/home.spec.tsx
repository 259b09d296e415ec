import { screen, waitFor, within } from '@testing-library/react';
import type { CurrentUser, ScanDetail, ScanSummary, WorkerPool } from '@sixtyfold/shared';
import { memberUser, scan } from '@/testing/fixtures';
import { naturalSpec } from '@/testing/scan-fixtures';
import { apiError, json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const page = (items: ScanSummary[]) => json(200, { items, total: items.length, page: 1, pageSize: 20 });

const running = scan({ id: 101, name: 'Plateau width sweep', status: 'running', donePoints: 110, failedPoints: 10, totalPoints: 400 });
const queuedOld = scan({ id: 102, name: 'Hilltop curvature grid', status: 'queued', donePoints: 0, createdAt: '2026-11-30T09:20:00.000Z' });
const queuedNew = scan({ id: 103, name: 'Natural inflation f scan', status: 'queued', donePoints: 0, createdAt: '2026-11-30T09:25:00.000Z' });
const finishedEarly = scan({ id: 90, name: 'Quartic hilltop check', status: 'failed', donePoints: 30, failedPoints: 70, totalPoints: 100, finishedAt: '2026-11-29T10:00:00.000Z' });
const finishedLate = scan({ id: 91, name: 'Starobinsky N_* band', status: 'completed', donePoints: 100, totalPoints: 100, finishedAt: '2026-11-29T18:00:00.000Z' });

function detailOf(summary: ScanSummary, progress: Partial<ScanDetail['progress']>): ScanDetail {
  return {
    ...summary,
    note: '',
    spec: naturalSpec,
    startedAt: '2026-11-30T09:16:00.000Z',
    progress: {
      total: summary.totalPoints,
      done: summary.donePoints,
      failed: summary.failedPoints,
      running: 8,
      queued: 0,
      elapsedSeconds: null,
      remainingSeconds: null,
      ...progress,
    },
  };
}

const pool: WorkerPool = {
  workers: [
    {
      id: 'calc-02:4242',
      host: 'calc-02',
      pid: 4242,
      concurrency: 4,
      startedAt: '2026-11-30T08:00:00.000Z',
      lastSeenAt: new Date(Date.now() - 60_000).toISOString(),
      chunksDone: 31,
      pointsDone: 12_480,
    },
    {
      id: 'calc-03:977',
      host: 'calc-03',
      pid: 977,
      concurrency: 2,
      startedAt: '2026-11-30T08:00:00.000Z',
      lastSeenAt: new Date(Date.now() - 60_000).toISOString(),
      chunksDone: 4,
      pointsDone: 800,
    },
  ],
  queue: { waiting: 7, active: 6, delayed: 1, failed: 2 },
};

/** The list endpoint, answering by its status filter as the API does. */
function scansByStatus(request: MockRequest) {
  const status = request.url.searchParams.get('status');
  if (status === 'running') return page([running]);
  if (status === 'queued') return page([queuedNew, queuedOld]);
  return page([running, queuedNew, queuedOld, finishedEarly, finishedLate]);
}

function mockOverview(overrides: Record<string, (request: MockRequest) => Response> = {}, user: CurrentUser = memberUser) {
  return mockApi({
    'GET /api/auth/me': () => json(200, user),
    'GET /api/scans': scansByStatus,
    'GET /api/scans/101': () => json(200, detailOf(running, { elapsedSeconds: 10, remainingSeconds: 240 })),
    'GET /api/workers/pool': () => json(200, pool),
    ...overrides,
  });
}

describe('Overview page', () => {
  afterEach(() => vi.useRealTimers());

  it('lists running scans before queued ones, with rate, time left and links to their pages', async () => {
    const { requests } = mockOverview();
    renderApp('/');

    const live = await screen.findByRole('region', { name: 'Running and queued' });
    await waitFor(() => expect(within(live).getAllByRole('article')).toHaveLength(3));
    const cards = within(live).getAllByRole('article');
    expect(cards.map((card) => within(card).getByRole('heading').textContent)).toEqual([
      'Plateau width sweep',
      'Natural inflation f scan',
      'Hilltop curvature grid',
    ]);
    expect(within(live).getByText('1 running')).toBeInTheDocument();
    expect(within(live).getByText('2 queued')).toBeInTheDocument();

    // (110 done + 10 failed) / 10 s, and the API's estimate of what is left.
    expect(await within(cards[0]).findByText('12 points/s')).toBeInTheDocument();
    expect(within(cards[0]).getByText('about 4 min')).toBeInTheDocument();
    expect(within(cards[0]).getByText('10 failed')).toBeInTheDocument();
    expect(within(cards[0]).getByRole('progressbar', { name: '110 of 400 points done' })).toBeInTheDocument();
    expect(within(cards[0]).getByRole('link', { name: 'Plateau width sweep' })).toHaveAttribute('href', '/scans/101');
    expect(within(cards[1]).getByText(/Waiting for a free worker slot/)).toBeInTheDocument();
    expect(within(cards[2]).getByRole('link', { name: 'Hilltop curvature grid' })).toHaveAttribute('href', '/scans/102');

    // Details only for the running scan: queued ones have no pace yet.
    expect(requests.filter((r) => /^\/api\/scans\/\d+$/.test(r.url.pathname)).map((r) => r.url.pathname)).toEqual(
      expect.arrayContaining(['/api/scans/101']),
    );
    expect(requests.some((r) => r.url.pathname === '/api/scans/102')).toBe(false);
    const statuses = requests.filter((r) => r.url.pathname === '/api/scans').map((r) => r.url.searchParams.get('status'));
    expect(statuses).toEqual(expect.arrayContaining(['running', 'queued']));
  });

  it('shows the worker pool at a glance', async () => {
    mockOverview();
    renderApp('/');

    const panel = await screen.findByRole('region', { name: 'Worker pool' });
    const figure = (label: string) => within(panel).getByText(label).nextElementSibling?.textContent;
    await waitFor(() => expect(figure('Processes alive')).toBe('2'));
    expect(figure('Concurrency')).toBe('6');
    expect(figure('Chunks waiting')).toBe('7');
    expect(figure('Chunks active')).toBe('6');
    expect(figure('Chunks delayed')).toBe('1');
    expect(figure('Chunks failed')).toBe('2');

    const rows = within(within(panel).getByRole('table', { name: 'Worker processes' })).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('calc-02:4242');
    expect(rows[1]).toHaveTextContent('4 slots');
    expect(rows[1]).toHaveTextContent('12,480');
    expect(rows[1]).toHaveTextContent(/\d+ s ago/);
    expect(rows[2]).toHaveTextContent('calc-03:977');
    expect(within(panel).queryByText(/No workers alive/)).not.toBeInTheDocument();
  });

  it('lists recently finished scans newest first, with their status, and offers New scan to a member', async () => {
    mockOverview();
    renderApp('/');

    const recent = await screen.findByRole('region', { name: 'Recently finished' });
    await waitFor(() => expect(within(recent).getAllByRole('listitem')).toHaveLength(2));
    const items = within(recent).getAllByRole('listitem');
    expect(items[0]).toHaveTextContent('Starobinsky N_* band');
    expect(items[0]).toHaveTextContent('Completed');
    expect(items[1]).toHaveTextContent('Quartic hilltop check');
    expect(items[1]).toHaveTextContent('Failed');
    expect(items[1]).toHaveTextContent('70 failed');
    expect(within(recent).queryByText('Plateau width sweep')).not.toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'New scan' })).toHaveAttribute('href', '/scans/new');
  });

  it('warns when no worker is alive, and keeps New scan from a viewer', async () => {
    const viewer: CurrentUser = { ...memberUser, memberships: [{ ...memberUser.memberships[0], role: 'viewer' }] };
    mockOverview({ 'GET /api/workers/pool': () => json(200, { workers: [], queue: { waiting: 12, active: 0, delayed: 0, failed: 0 } }) }, viewer);
    renderApp('/');

    expect(await screen.findByText('No workers alive: queued scans will wait')).toBeInTheDocument();
    expect(screen.queryByRole('table', { name: 'Worker processes' })).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'New scan' })).not.toBeInTheDocument();
  });

  it('says what went wrong when the live scans or the pool cannot be loaded', async () => {
    mockOverview({
      'GET /api/scans': () => apiError(503, 'The database is not answering'),
      'GET /api/workers/pool': () => apiError(503, 'Redis is not answering'),
    });
    renderApp('/');

    expect(await screen.findByText('Could not load running and queued scans')).toBeInTheDocument();
    expect(await screen.findByText('Could not load the worker pool')).toBeInTheDocument();
    expect(screen.getAllByRole('alert').map((a) => a.textContent)).toEqual(
      expect.arrayContaining([expect.stringContaining('Redis is not answering'), expect.stringContaining('The database is not answering')]),
    );
    expect(screen.getAllByRole('button', { name: 'Try again' }).length).toBeGreaterThanOrEqual(2);
  });

  it('moves the progress on as the scan advances, without a reload', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true });
    let done = 110;
    mockOverview({
      'GET /api/scans/101': () => json(200, detailOf({ ...running, donePoints: done }, { elapsedSeconds: 10, remainingSeconds: 240 })),
    });
    renderApp('/');

    expect(await screen.findByRole('progressbar', { name: '110 of 400 points done' })).toBeInTheDocument();
    done = 250;
    await vi.advanceTimersByTimeAsync(2_500);
    expect(await screen.findByRole('progressbar', { name: '250 of 400 points done' })).toBeInTheDocument();
  });
});
