import { configure, screen, within } from '@testing-library/react';
import { POTENTIAL_FAMILIES, type CurrentUser } from '@sixtyfold/shared';
import { memberUser } from '@/testing/fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
import { logModel } from '../model-fixtures';

// The families list typesets eleven formulas, which happy-dom takes seconds to lay out.
configure({ asyncUtilTimeout: 10_000 });
vi.setConfig({ testTimeout: 30_000 });

const viewerUser: CurrentUser = {
  ...memberUser,
  memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'viewer' }],
};

describe('models page', () => {
  it('lists every built-in family with its paper, and each group model linking to its page', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models': () => json(200, [logModel]) });
    renderApp('/models');

    const families = within(await screen.findByRole('region', { name: 'Built-in families' }));
    // The families render just after the rest of the page (a deferred render).
    await families.findByRole('article', { name: POTENTIAL_FAMILIES[0].name });
    for (const family of POTENTIAL_FAMILIES) {
      const card = families.getByRole('article', { name: family.name });
      expect(card).toHaveTextContent(family.reference);
      expect(within(card).getByRole('link', { name: family.name })).toHaveAttribute('href', `/models/families/${family.key}`);
    }

    const models = within(screen.getByRole('region', { name: 'Your groups’ models' }));
    const card = await models.findByRole('article', { name: 'Quadratic with a log correction' });
    expect(within(card).getByRole('link', { name: 'Quadratic with a log correction' })).toHaveAttribute('href', '/models/7');
    expect(card).toHaveTextContent('Plateau Lab');
    expect(screen.getByRole('link', { name: 'New model' })).toHaveAttribute('href', '/models/new');
  });

  it('offers New model only to members of some group, and explains an empty list', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, viewerUser), 'GET /api/models': () => json(200, []) });
    renderApp('/models');

    expect(await screen.findByText('No models yet')).toBeInTheDocument();
    expect(screen.getByText(/Members of a group can write one/)).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'New model' })).not.toBeInTheDocument();
  });
});
