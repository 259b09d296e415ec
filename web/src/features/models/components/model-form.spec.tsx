import { configure, screen, waitFor, within } from '@testing-library/react';
import type { CurrentUser } from '@sixtyfold/shared';
import { memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
import { logModel } from '../model-fixtures';

// Checking an expression parses and differentiates it, which happy-dom runs slowly.
configure({ asyncUtilTimeout: 10_000 });
vi.setConfig({ testTimeout: 30_000 });

const twoGroups: CurrentUser = {
  ...memberUser,
  memberships: [
    { groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'member' },
    { groupId: 12, groupSlug: 'tensor-desk', groupName: 'Tensor Desk', role: 'lead' },
    { groupId: 13, groupSlug: 'reading-room', groupName: 'Reading Room', role: 'viewer' },
  ],
};

const created = { ...logModel, id: 31, groupId: 12, name: 'Quartic', expression: 'lambda * phi^4' };

describe('new model form', () => {
  it('marks an expression problem while typing and clears it once fixed', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, twoGroups) });
    const { user } = renderApp('/models/new');

    await user.type(await screen.findByLabelText('Parameter 1 name'), 'lambda');
    const expression = screen.getByLabelText('Expression V(φ)');
    await user.type(expression, 'lambda * phj^4');

    expect(await screen.findByText(/At character 10: unknown symbol 'phj'/)).toBeInTheDocument();
    expect(screen.getByTestId('expression-marker')).toHaveTextContent(/phj/);
    expect(screen.getByTestId('expression-marker').querySelector('mark')).toHaveTextContent('phj');

    await user.clear(expression);
    await user.type(expression, 'lambda * phi^4');
    expect(await screen.findByText('The engine reads this potential.')).toBeInTheDocument();
    expect(screen.queryByText(/unknown symbol/)).not.toBeInTheDocument();
    expect(screen.queryByTestId('expression-marker')).not.toBeInTheDocument();
  });

  it('names declared parameters the expression does not use', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, twoGroups) });
    const { user } = renderApp('/models/new');

    await user.type(await screen.findByLabelText('Parameter 1 name'), 'lambda');
    await user.click(screen.getByRole('button', { name: 'Add parameter' }));
    await user.type(screen.getByLabelText('Parameter 2 name'), 'mu');
    await user.type(screen.getByLabelText('Expression V(φ)'), 'lambda * phi^4');

    expect(await screen.findByText(/Declared but not used/)).toHaveTextContent('Declared but not used: mu');
  });

  it('offers only groups where I am a member, preselects ?group= and posts the typed model', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, twoGroups),
      'POST /api/models': () => json(201, created),
      'GET /api/models/31': () => json(200, created),
    });
    const { user, router } = renderApp('/models/new?group=12');

    const group = await screen.findByLabelText('Group');
    expect(within(group).getAllByRole('option').map((o) => o.textContent)).toEqual(['Choose a group', 'Plateau Lab', 'Tensor Desk']);
    expect(group).toHaveValue('12');

    await user.type(screen.getByLabelText('Name'), '  Quartic ');
    await user.type(screen.getByLabelText('Expression V(φ)'), 'lambda * phi^4');
    await user.type(screen.getByLabelText('Parameter 1 name'), 'lambda');
    await user.type(screen.getByLabelText('Parameter 1 default'), '1e-14');
    await user.type(screen.getByLabelText('Parameter 1 max'), '1e-12');
    await user.type(screen.getByLabelText('Parameter 1 description'), 'self-coupling');
    await user.type(screen.getByLabelText('φ_init'), '22');
    await user.click(screen.getByRole('button', { name: 'Create model' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/models/31'));
    const posts = requests.filter((r) => r.method === 'POST');
    expect(posts).toHaveLength(1);
    expect(posts[0].body).toEqual({
      groupId: 12,
      name: 'Quartic',
      expression: 'lambda * phi^4',
      parameters: [{ name: 'lambda', defaultValue: 1e-14, max: 1e-12, description: 'self-coupling' }],
      phiInit: 22,
      description: '',
    });
  });

  it('checks the form with the shared schema before posting', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(200, twoGroups) });
    const { user } = renderApp('/models/new');

    await user.type(await screen.findByLabelText('Parameter 1 name'), 'phi');
    await user.type(screen.getByLabelText('Parameter 1 default'), 'abc');
    await user.click(screen.getByRole('button', { name: 'Create model' }));

    expect(await screen.findByText('Choose the group')).toBeInTheDocument();
    expect(screen.getByText('Give the model a name')).toBeInTheDocument();
    expect(screen.getByText('Phi is the field; give the parameter another name')).toBeInTheDocument();
    expect(screen.getByText('Enter a number, e.g. 1e-10')).toBeInTheDocument();
    expect(screen.getByText(/Give φ_init/)).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it("shows a 409's message and puts the API's field errors beside their fields", async () => {
    let answer = apiError(409, 'Tensor Desk already has a model named "Quartic"; choose another name');
    mockApi({ 'GET /api/auth/me': () => json(200, twoGroups), 'POST /api/models': () => answer });
    const { user } = renderApp('/models/new?group=12');

    await user.type(await screen.findByLabelText('Name'), 'Quartic');
    await user.type(screen.getByLabelText('Expression V(φ)'), 'lambda * phi^4');
    await user.type(screen.getByLabelText('Parameter 1 name'), 'lambda');
    await user.type(screen.getByLabelText('Parameter 1 default'), '1e-14');
    await user.type(screen.getByLabelText('φ_init'), '22');
    await user.click(screen.getByRole('button', { name: 'Create model' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Could not create the model');
    expect(alert).toHaveTextContent('Tensor Desk already has a model named "Quartic"; choose another name');

    answer = apiError(400, 'parameters.0.max: max must be above min (5)', { 'parameters.0.max': ['max must be above min (5)'] });
    await user.click(screen.getByRole('button', { name: 'Create model' }));
    expect(await screen.findByText('Max must be above min (5)')).toBeInTheDocument();
    expect(screen.getByLabelText('Parameter 1 max')).toHaveAttribute('aria-invalid', 'true');
  });

  it('explains that viewers cannot add models', async () => {
    mockApi({
      'GET /api/auth/me': () =>
        json(200, { ...memberUser, memberships: [{ groupId: 13, groupSlug: 'reading-room', groupName: 'Reading Room', role: 'viewer' }] }),
    });
    renderApp('/models/new');

    expect(await screen.findByText('Only group members can add models')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Create model' })).not.toBeInTheDocument();
  });
});

describe('edit model form', () => {
  it('starts from the stored model and sends the changes with PATCH', async () => {
    const saved = { ...logModel, name: 'Quadratic, log-corrected' };
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/models/7': () => json(200, logModel),
      'PATCH /api/models/7': () => json(200, saved),
    });
    const { user, router } = renderApp('/models/7/edit');

    const name = await screen.findByLabelText('Name');
    expect(name).toHaveValue('Quadratic with a log correction');
    expect(screen.getByLabelText('Group')).toBeDisabled();
    expect(screen.getByLabelText('Parameter 2 name')).toHaveValue('c');
    expect(screen.getByLabelText('φ_init')).toHaveValue('17');

    await user.clear(name);
    await user.type(name, 'Quadratic, log-corrected');
    await user.click(screen.getByRole('button', { name: 'Remove parameter 2' }));
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    // c is gone but the expression still uses it: the shared schema refuses before the API sees it.
    expect(await screen.findByText(/unknown symbol 'c'/)).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Add parameter' }));
    await user.type(screen.getByLabelText('Parameter 2 name'), 'c');
    await user.type(screen.getByLabelText('Parameter 2 default'), '0.01');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/models/7'));
    const patch = requests.find((r) => r.method === 'PATCH');
    expect(patch?.body).toEqual({
      name: 'Quadratic, log-corrected',
      expression: logModel.expression,
      parameters: [
        { name: 'm', defaultValue: 6e-6, min: 1e-7, max: 1e-4, description: 'inflaton mass' },
        { name: 'c', defaultValue: 0.01, description: '' },
      ],
      phiInit: 17,
      description: logModel.description,
    });
  });
});
