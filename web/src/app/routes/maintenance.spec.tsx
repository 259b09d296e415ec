import type { PrunePlan, ScanArchive, StorageReport } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { adminUser, memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const storage: StorageReport = {
  tables: [{ table: 'scan_points', rows: 3000, dataBytes: 300_000, indexBytes: 60_000 }],
  bytesPerPoint: 120,
  groups: [
    { groupId: 10, groupName: 'Plateau Lab', scans: 2, points: 1000, bytes: 120_000, archives: 1, archiveBytes: 2048 },
    { groupId: 12, groupName: 'Tensor Desk', scans: 1, points: 2000, bytes: 240_000, archives: 0, archiveBytes: 0 },
  ],
  scans: [
    { scanId: 7, name: 'big tensor grid', groupId: 12, status: 'completed', points: 2000, bytes: 240_000 },
    { scanId: 3, name: 'small plateau run', groupId: 10, status: 'failed', points: 200, bytes: 24_000 },
    { scanId: 4, name: 'medium plateau run', groupId: 10, status: 'completed', points: 800, bytes: 96_000 },
  ],
  retention: { cron: '30 3 * * *', nextRunAt: '2026-12-03T03:30:00.000Z' },
};

const archive: ScanArchive = {
  id: 21, scanId: 2, scanName: 'old starobinsky sweep', groupId: 10, fileName: 'scan-2-20261201T101500-a1b2c3.tar.gz', bytes: 2048,
  sha256: 'f'.repeat(64), points: 400, createdById: 1, createdByName: 'Amara Okafor', createdAt: '2026-12-01T10:15:00.000Z',
};

const plan: PrunePlan = {
  items: [
    { scanId: 3, name: 'small plateau run', groupId: 10, groupName: 'Plateau Lab', ownerId: 2, ownerName: 'Tomas Lindqvist', status: 'failed', createdAt: '2026-08-01T09:00:00.000Z', finishedAt: '2026-08-01T10:00:00.000Z', points: 200, bytes: 24_000 },
    { scanId: 4, name: 'medium plateau run', groupId: 10, groupName: 'Plateau Lab', ownerId: 2, ownerName: 'Tomas Lindqvist', status: 'completed', createdAt: '2026-08-02T09:00:00.000Z', finishedAt: '2026-08-02T10:00:00.000Z', points: 800, bytes: 96_000 },
  ],
  totalPoints: 1000,
  totalBytes: 120_000,
};

function mockMaintenance(overrides: Record<string, Parameters<typeof mockApi>[0][string]> = {}) {
  return mockApi({
    'GET /api/auth/me': () => json(200, adminUser),
    'GET /api/maintenance/storage': () => json(200, storage),
    'GET /api/maintenance/archives': () => json(200, [archive]),
    'GET /api/admin/users': () => json(200, []),
    ...overrides,
  });
}

describe('maintenance page', () => {
  it('shows storage per group and per scan, largest first, and sorts by size both ways', async () => {
    mockMaintenance();
    const { user } = renderApp('/admin/maintenance');

    const scans = await screen.findByRole('table', { name: 'Storage per scan' }, { timeout: 5000 });
    const names = () => within(scans).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[0].textContent);
    expect(names()).toEqual(['big tensor grid', 'medium plateau run', 'small plateau run']);
    await user.click(within(scans).getByRole('button', { name: /Sort by size/ }));
    expect(names()).toEqual(['small plateau run', 'medium plateau run', 'big tensor grid']);

    const groups = screen.getByRole('table', { name: 'Storage per group' });
    const groupRows = within(groups).getAllByRole('row').slice(1);
    expect(groupRows[0]).toHaveTextContent('Tensor Desk');
    expect(groupRows[0]).toHaveTextContent('234 kB');
    expect(screen.getByText(/InnoDB reports sizes per table/)).toBeInTheDocument();
  });

  it('lists what a prune would delete, confirms exactly those scans, and sends their ids with the filter', async () => {
    const { requests } = mockMaintenance({
      'POST /api/maintenance/prune/dry-run': () => json(200, plan),
      'POST /api/maintenance/prune': () => json(200, { deleted: [{ scanId: 3, archiveId: 30, points: 200 }, { scanId: 4, archiveId: 31, points: 800 }] }),
    });
    const { user } = renderApp('/admin/maintenance');

    // The group choices come with the storage figures.
    await screen.findByRole('option', { name: 'Plateau Lab' }, { timeout: 5000 });
    await user.selectOptions(screen.getByLabelText('Group'), 'Plateau Lab');
    await user.clear(screen.getByLabelText('Older than (days)'));
    await user.type(screen.getByLabelText('Older than (days)'), '30');
    await user.type(screen.getByLabelText('Tag'), 'pilot');
    await user.click(screen.getByRole('button', { name: 'List what would go' }));

    const listed = await screen.findByRole('table', { name: 'Scans that would be deleted' });
    expect(within(listed).getAllByRole('row')).toHaveLength(3);
    expect(screen.getByText(/2 scans would go: 1000 points/)).toBeInTheDocument();
    const dryRun = requests.find((r) => r.url.pathname === '/api/maintenance/prune/dry-run')!;
    expect(dryRun.body).toEqual({ groupId: 10, olderThanDays: 30, ageBasis: 'finished', statuses: ['completed', 'failed', 'cancelled'], tag: 'pilot' });

    await user.click(screen.getByRole('button', { name: 'Prune these 2 scans…' }));
    const dialog = await screen.findByRole('alertdialog');
    const items = within(within(dialog).getByRole('list', { name: 'Scans to delete' })).getAllByRole('listitem');
    expect(items.map((i) => i.textContent)).toEqual([
      'small plateau run (#3, Plateau Lab, 200 points)',
      'medium plateau run (#4, Plateau Lab, 800 points)',
    ]);
    expect(requests.some((r) => r.url.pathname === '/api/maintenance/prune')).toBe(false);
    await user.click(within(dialog).getByRole('button', { name: 'Archive and delete' }));

    expect(await screen.findByText('Deleted 2 scans')).toBeInTheDocument();
    const pruned = requests.find((r) => r.url.pathname === '/api/maintenance/prune')!;
    expect(pruned.body).toEqual({ ...(dryRun.body as object), scanIds: [3, 4] });
  });

  it('shows the refusal when the selection changed since the dry run', async () => {
    mockMaintenance({
      'POST /api/maintenance/prune/dry-run': () => json(200, plan),
      'POST /api/maintenance/prune': () =>
        apiError(409, "Nothing was deleted: the filter's selection changed since the dry run (it now also selects scan 9). Run the dry run again.", { unseen: ['9'] }),
    });
    const { user } = renderApp('/admin/maintenance');
    await user.click(await screen.findByRole('button', { name: 'List what would go' }));
    await user.click(await screen.findByRole('button', { name: 'Prune these 2 scans…' }));
    const dialog = await screen.findByRole('alertdialog');
    await user.click(within(dialog).getByRole('button', { name: 'Archive and delete' }));
    expect(await within(dialog).findByText(/it now also selects scan 9/)).toBeInTheDocument();
    expect(within(dialog).getByText('Nothing was deleted')).toBeInTheDocument();
  });

  it('offers each archive for download', async () => {
    mockMaintenance();
    renderApp('/admin/maintenance');
    const table = await screen.findByRole('table', { name: 'Archives' });
    expect(within(table).getByText(/old starobinsky sweep/)).toBeInTheDocument();
    expect(within(table).getByRole('link', { name: 'Download' })).toHaveAttribute('href', '/api/maintenance/archives/21/download');
  });

  it('is for site admins only', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser) });
    renderApp('/admin/maintenance');
    await waitFor(() => expect(screen.getByText('This area is for site administrators')).toBeInTheDocument());
  });
});
