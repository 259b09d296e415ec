import type { OutboxMessage } from '@sixtyfold/shared';
import { screen, within } from '@testing-library/react';
import { adminUser, memberUser } from '@/testing/fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const LINK = 'http://127.0.0.1:3060/invitations/31.1796900000000.Q1w2E3r4T5y6U7i8O9p0A1s2D3f4G5h6J7k8L9z0X1c';
const invitation: OutboxMessage = {
  id: '1796900000000-000001',
  receivedAt: '2026-12-01T09:00:00.000Z',
  from: 'Sixtyfold <no-reply@sixtyfold.example>',
  to: ['noor.haddad@halvorsen.example'],
  subject: 'Henrik Solberg invites you to Plateau Lab on Sixtyfold',
  text: `Join Plateau Lab\n\nAccept the invitation: ${LINK}\n`,
  html: `<p><a href="${LINK}">Accept the invitation</a></p><script>parent.alert(1)</script>`,
  messageId: '<abc@sixtyfold.example>',
};

describe('mail outbox pages', () => {
  it('lists caught messages for admins, linking to each', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/admin/outbox': () => json(200, { items: [invitation], total: 1, page: 1, pageSize: 50 }),
    });
    renderApp('/admin/outbox');
    const table = await screen.findByRole('table', { name: 'Caught messages' });
    expect(table).toHaveTextContent('noor.haddad@halvorsen.example');
    expect(within(table).getByRole('link', { name: invitation.subject })).toHaveAttribute('href', '/admin/outbox/1796900000000-000001');
    expect(requests.find((r) => r.url.pathname === '/api/admin/outbox')?.url.searchParams.get('page')).toBe('1');
    expect(screen.getAllByRole('link', { name: 'Mail outbox', hidden: true }).length).toBeGreaterThan(0);
  });

  it('shows one message: text with clickable links, HTML in a sandboxed frame', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/admin/outbox/1796900000000-000001': () => json(200, invitation),
    });
    renderApp('/admin/outbox/1796900000000-000001');
    expect(await screen.findByRole('heading', { name: invitation.subject })).toBeInTheDocument();
    const text = screen.getByTestId('outbox-text-body');
    expect(within(text).getByRole('link', { name: LINK })).toHaveAttribute('href', LINK);
    const frame = screen.getByTitle('HTML version of the message');
    expect(frame).toHaveAttribute('sandbox', '');
    expect(frame).toHaveAttribute('srcdoc', invitation.html);
  });

  it('is closed to users who are not site admins', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(200, memberUser) });
    renderApp('/admin/outbox');
    expect(await screen.findByText('This area is for site administrators')).toBeInTheDocument();
    expect(requests.some((r) => r.url.pathname.startsWith('/api/admin/'))).toBe(false);
    expect(screen.queryByRole('link', { name: 'Mail outbox', hidden: true })).not.toBeInTheDocument();
  });
});

describe('admin groups page', () => {
  it('lists every group and creates one with the shared schema', async () => {
    const created = { id: 12, slug: 'reheating-studies', name: 'Reheating Studies', description: '', myRole: null, memberCount: 0, pointLimit: 5000, members: [] };
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/groups': () => json(200, [{ id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: 'plateaus', myRole: 'lead', memberCount: 3 }]),
      'POST /api/groups': () => json(201, created),
      'GET /api/groups/12': () => json(200, created),
      'GET /api/groups/12/invitations': () => json(200, []),
    });
    const { user, router } = renderApp('/admin/groups');
    const table = await screen.findByRole('table', { name: 'Groups' });
    expect(within(table).getByRole('link', { name: 'Plateau Lab' })).toHaveAttribute('href', '/groups/10');

    const form = screen.getByRole('form', { name: 'Create a group' });
    await user.type(within(form).getByLabelText('Name'), 'R');
    await user.click(within(form).getByRole('button', { name: 'Create group' }));
    expect(await within(form).findByText('Group names have at least 2 characters')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.type(within(form).getByLabelText('Name'), 'eheating Studies');
    await user.clear(within(form).getByLabelText('Point limit'));
    await user.type(within(form).getByLabelText('Point limit'), '5000');
    await user.click(within(form).getByRole('button', { name: 'Create group' }));
    expect(await screen.findByRole('heading', { name: 'Reheating Studies' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/groups/12');
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ name: 'Reheating Studies', description: '', pointLimit: 5000 });
  });
});
