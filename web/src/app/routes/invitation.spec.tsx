import type { InvitationPreview } from '@sixtyfold/shared';
import { screen, waitFor } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const TOKEN = '31.1796900000000.Q1w2E3r4T5y6U7i8O9p0A1s2D3f4G5h6J7k8L9z0X1c';

const forNewcomer: InvitationPreview = {
  groupId: 10,
  groupName: 'Plateau Lab',
  role: 'member',
  email: 'noor.haddad@halvorsen.example',
  invitedByName: 'Henrik Solberg',
  expiresAt: '2026-12-08T09:00:00.000Z',
  accountExists: false,
};
const forMember: InvitationPreview = { ...forNewcomer, email: memberUser.email, accountExists: true };
const signedOut = () => apiError(401, 'Sign in first: your session is missing or has expired');

describe('invitation page', () => {
  it('creates the account of a new address, validated by the shared schema, and opens the group', async () => {
    const joined = { id: 40, email: forNewcomer.email, displayName: 'Noor Haddad', siteRole: 'user', memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'member' }] };
    const { requests } = mockApi({
      'GET /api/auth/me': signedOut,
      [`GET /api/invitations/${TOKEN}`]: () => json(200, forNewcomer),
      [`POST /api/invitations/${TOKEN}/accept`]: () => json(201, joined),
      'GET /api/groups/10': () => json(200, { id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: '', myRole: 'member', memberCount: 1, pointLimit: 1000, members: [] }),
    });
    const { user, router } = renderApp(`/invitations/${TOKEN}`);

    expect(await screen.findByRole('heading', { name: 'Join Plateau Lab' })).toBeInTheDocument();
    expect(screen.getByText('Henrik Solberg invited noor.haddad@halvorsen.example to this group on Sixtyfold.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail address')).toHaveValue('noor.haddad@halvorsen.example');

    await user.type(screen.getByLabelText('Your name'), 'Noor Haddad');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(await screen.findByText('Choose a password of at least 10 characters')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.clear(screen.getByLabelText('Password'));
    await user.type(screen.getByLabelText('Password'), 'slow-roll-plateau-9');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/groups/10'));
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ displayName: 'Noor Haddad', password: 'slow-roll-plateau-9' });
  });

  it('asks an existing account to sign in first, with a way back to the link', async () => {
    mockApi({ 'GET /api/auth/me': signedOut, [`GET /api/invitations/${TOKEN}`]: () => json(200, forMember) });
    renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByText(`${memberUser.email} already has a Sixtyfold account. Sign in first, and you come back here to join.`)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in first' })).toHaveAttribute('href', `/sign-in?next=${encodeURIComponent(`/invitations/${TOKEN}`)}`);
    expect(screen.queryByRole('button', { name: /Join/ })).not.toBeInTheDocument();
  });

  it('lets the signed-in invitee join with one button', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      [`GET /api/invitations/${TOKEN}`]: () => json(200, forMember),
      [`POST /api/invitations/${TOKEN}/accept`]: () => json(201, memberUser),
      'GET /api/groups/10': () => json(200, { id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: '', myRole: 'member', memberCount: 1, pointLimit: 1000, members: [] }),
    });
    const { user, router } = renderApp(`/invitations/${TOKEN}`);
    await user.click(await screen.findByRole('button', { name: 'Join Plateau Lab' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/groups/10'));
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({});
  });

  it('tells someone signed in with another account to switch', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), [`GET /api/invitations/${TOKEN}`]: () => json(200, { ...forMember, email: 'mei.nakamura@halvorsen.example' }) });
    renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByText(`You are signed in as ${memberUser.email}. Sign out, then sign in as mei.nakamura@halvorsen.example to join.`)).toBeInTheDocument();
  });

  it('shows why a used, revoked or expired link cannot be used', async () => {
    mockApi({
      'GET /api/auth/me': signedOut,
      [`GET /api/invitations/${TOKEN}`]: () => apiError(410, 'This invitation has expired; ask the group lead to invite you again'),
    });
    renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByRole('heading', { name: 'This invitation cannot be used' })).toBeInTheDocument();
    expect(screen.getByRole('alert')).toHaveTextContent('This invitation has expired; ask the group lead to invite you again');
    expect(screen.getByRole('link', { name: 'Sign in' })).toHaveAttribute('href', '/sign-in');
  });
});
