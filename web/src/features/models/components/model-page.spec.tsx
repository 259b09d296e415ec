import { configure, screen, waitFor, within } from '@testing-library/react';
import type { CurrentUser } from '@sixtyfold/shared';
import { adminUser, memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
import { logModel } from '../model-fixtures';

// These pages parse and differentiate a potential and run the engine inline on the test's thread.
configure({ asyncUtilTimeout: 10_000 });
vi.setConfig({ testTimeout: 30_000 });

const viewerUser: CurrentUser = {
  ...memberUser,
  memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'viewer' }],
};

describe('model page', () => {
  it('shows the model with its parameters, and Edit but not Delete to a member', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models/7': () => json(200, logModel) });
    renderApp('/models/7');

    expect(await screen.findByRole('heading', { level: 1, name: 'Quadratic with a log correction' })).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Parameters of Quadratic with a log correction' });
    expect(within(table).getAllByRole('row')).toHaveLength(1 + logModel.parameters.length);
    expect(screen.getByRole('link', { name: 'Edit model' })).toHaveAttribute('href', '/models/7/edit');
    expect(screen.queryByRole('button', { name: 'Delete model' })).not.toBeInTheDocument();
    // The stored start prefills the trial's φ_init.
    expect(await screen.findByLabelText('φ_init')).toHaveValue('17');
  });

  it('says which parameter only scales the expression, detected in the browser, or that none does', async () => {
    // Closed form: 0.5 m² φ² (1 + c ln φ²) = m² · g(φ, c), so V ∝ m².
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models/7': () => json(200, logModel) });
    const { unmount } = renderApp('/models/7');
    expect(await screen.findByText('m (V ∝ m²): points that differ only in m, N_* or the reheating share one background integration')).toBeInTheDocument();
    unmount();

    // m and c sit in different terms of a sum: neither factors out of V.
    const sum = { ...logModel, expression: '0.5 * m^2 * phi^2 + c * phi^4' };
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models/7': () => json(200, sum) });
    renderApp('/models/7');
    expect(
      await screen.findByText('none: no parameter only scales V, so only points that differ in N_* or the reheating share one background integration'),
    ).toBeInTheDocument();
  });

  it('shows neither Edit nor Delete to a viewer', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, viewerUser), 'GET /api/models/7': () => json(200, logModel) });
    renderApp('/models/7');

    expect(await screen.findByRole('heading', { level: 1, name: 'Quadratic with a log correction' })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Edit model' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Delete model' })).not.toBeInTheDocument();
  });

  it('deletes after confirmation and goes back to the models list', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/models/7': () => json(200, logModel),
      'DELETE /api/models/7': () => new Response(null, { status: 204 }),
      'GET /api/models': () => json(200, []),
    });
    const { user, router } = renderApp('/models/7');

    await user.click(await screen.findByRole('button', { name: 'Delete model' }));
    const dialog = await screen.findByRole('alertdialog', { name: 'Delete “Quadratic with a log correction”?' });
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);
    await user.click(within(dialog).getByRole('button', { name: 'Yes, delete' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/models'));
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.url.pathname)).toEqual(['/api/models/7']);
  });

  it('keeps the dialog open with the reason when the API refuses the delete', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/models/7': () => json(200, logModel),
      'DELETE /api/models/7': () => apiError(403, 'Only leads of Plateau Lab can delete its models'),
    });
    const { user, router } = renderApp('/models/7');

    await user.click(await screen.findByRole('button', { name: 'Delete model' }));
    const dialog = await screen.findByRole('alertdialog');
    await user.click(within(dialog).getByRole('button', { name: 'Yes, delete' }));

    expect(await within(dialog).findByRole('alert')).toHaveTextContent('Only leads of Plateau Lab can delete its models');
    expect(router.state.location.pathname).toBe('/models/7');
  });

  it('says so when the model does not exist', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models/99': () => apiError(404, 'No such model') });
    renderApp('/models/99');

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('This model does not exist, or it belongs to a group you are not in');
    expect(alert).toHaveTextContent('No such model');
  });
});
