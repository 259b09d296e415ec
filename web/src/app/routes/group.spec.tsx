import type { ConstraintRegion, GroupDetail, Invitation, RetentionPolicy } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { adminUser, memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const leadUser = { ...memberUser, memberships: [{ ...memberUser.memberships[0], role: 'lead' as const }] };

const plateauLab = (): GroupDetail => ({
  id: 10,
  slug: 'plateau-lab',
  name: 'Plateau Lab',
  description: 'Plateau potentials and their tensor ratios',
  myRole: 'lead',
  memberCount: 2,
  pointLimit: 1_000_000,
  members: [
    { userId: 2, displayName: 'Tomas Lindqvist', email: 'tomas.lindqvist@halvorsen.example', role: 'lead' },
    { userId: 7, displayName: 'Lucía Marín', email: 'lucia.marin@halvorsen.example', role: 'member' },
  ],
});

const pending: Invitation = {
  id: 31,
  groupId: 10,
  email: 'new.student@halvorsen.example',
  role: 'viewer',
  invitedByName: 'Tomas Lindqvist',
  createdAt: '2026-12-01T09:00:00.000Z',
  expiresAt: '2026-12-08T09:00:00.000Z',
  inviteeUserId: null,
};

const keptForEver: RetentionPolicy = { keepDays: null, statuses: ['cancelled', 'completed', 'failed'] };

/** The page's other sections, answered so that each test sees only the section it is about. */
const otherSections = ({ retention = keptForEver, regions = [] as ConstraintRegion[] } = {}) => ({
  'GET /api/maintenance/groups/10/retention': () => json(200, retention),
  'GET /api/constraint-regions': () => json(200, regions),
});

describe('group page', () => {
  it('shows a viewer the members without management controls', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: 'viewer' }),
    });
    renderApp('/groups/10');
    expect(await screen.findByRole('heading', { name: 'Plateau Lab' })).toBeInTheDocument();
    expect(screen.getByRole('row', { name: /Lucía Marín/ })).toBeInTheDocument();
    expect(screen.queryByLabelText('Role of Lucía Marín')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Remove Lucía Marín' })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Invite someone' })).not.toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Leave group' })).toBeInTheDocument();
  });

  it('lets a lead change a role and shows why the API refused one', async () => {
    let group = plateauLab();
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, leadUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, group),
      'GET /api/groups/10/invitations': () => json(200, []),
      'PATCH /api/groups/10/members/7': (request) => {
        const role = (request.body as { role: 'lead' }).role;
        group = { ...group, members: group.members.map((m) => (m.userId === 7 ? { ...m, role } : m)) };
        return json(200, group.members[1]);
      },
      'PATCH /api/groups/10/members/2': () =>
        apiError(409, 'Tomas Lindqvist is the last lead of Plateau Lab and cannot be demoted; make someone else lead first'),
    });
    const { user } = renderApp('/groups/10');

    await user.selectOptions(await screen.findByLabelText('Role of Lucía Marín'), 'lead');
    await waitFor(() => expect(screen.getByLabelText('Role of Lucía Marín')).toHaveValue('lead'));
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ role: 'lead' });

    await user.selectOptions(screen.getByLabelText('Role of Tomas Lindqvist'), 'member');
    expect(await screen.findByRole('alert')).toHaveTextContent('is the last lead of Plateau Lab');
    // The list is re-read, so the select shows the role that was kept.
    await waitFor(() => expect(screen.getByLabelText('Role of Tomas Lindqvist')).toHaveValue('lead'));
  });

  it('removes a member only after confirmation', async () => {
    let group = plateauLab();
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, leadUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, group),
      'GET /api/groups/10/invitations': () => json(200, []),
      'DELETE /api/groups/10/members/7': () => {
        group = { ...group, memberCount: 1, members: group.members.slice(0, 1) };
        return new Response(null, { status: 204 });
      },
    });
    const { user } = renderApp('/groups/10');

    await user.click(await screen.findByRole('button', { name: 'Remove Lucía Marín' }));
    const dialog = await screen.findByRole('alertdialog');
    expect(dialog).toHaveTextContent('Remove Lucía Marín from Plateau Lab?');
    await user.click(within(dialog).getByRole('button', { name: 'Remove member' }));
    await waitFor(() => expect(screen.queryByRole('row', { name: /Lucía Marín/ })).not.toBeInTheDocument());
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.url.pathname)).toEqual(['/api/groups/10/members/7']);
  });

  it('invites with the shared schema, lists the pending invitation and revokes it', async () => {
    let invitations: Invitation[] = [];
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: null }),
      'GET /api/groups/10/invitations': () => json(200, invitations),
      'POST /api/groups/10/invitations': (request) => {
        const body = request.body as { email: string; role: 'viewer' };
        invitations = [{ ...pending, ...body }];
        return json(201, invitations[0]);
      },
      'DELETE /api/groups/10/invitations/31': () => {
        invitations = [];
        return new Response(null, { status: 204 });
      },
    });
    const { user } = renderApp('/groups/10');

    const form = await screen.findByRole('form', { name: 'Invite someone' });
    await user.type(within(form).getByLabelText('E-mail address'), 'not an address');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(await within(form).findByText('Enter an e-mail address like name@institute.example')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.clear(within(form).getByLabelText('E-mail address'));
    await user.type(within(form).getByLabelText('E-mail address'), 'New.Student@halvorsen.example');
    await user.selectOptions(within(form).getByLabelText('Role'), 'viewer');
    expect(within(form).getByText('A viewer may read the models, scans and results.')).toBeInTheDocument();
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('Invitation sent to new.student@halvorsen.example.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ email: 'new.student@halvorsen.example', role: 'viewer' });

    const table = await screen.findByRole('table', { name: 'Pending invitations' });
    expect(table).toHaveTextContent('new.student@halvorsen.example');
    await user.click(within(table).getByRole('button', { name: 'Revoke the invitation to new.student@halvorsen.example' }));
    await user.click(within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Revoke invitation' }));
    expect(await screen.findByText('No invitations are waiting for an answer.')).toBeInTheDocument();
  });

  it('shows the mail server problem when an invitation could not be sent', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, leadUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, plateauLab()),
      'GET /api/groups/10/invitations': () => json(200, []),
      'POST /api/groups/10/invitations': () => apiError(502, 'The mail server refused the invitation to x@halvorsen.example, so it was not saved'),
    });
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Invite someone' });
    await user.type(within(form).getByLabelText('E-mail address'), 'x@halvorsen.example');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(await within(form).findByRole('alert')).toHaveTextContent('The mail server refused the invitation');
  });

  it('lets a site admin edit the name and point limit', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: null }),
      'GET /api/groups/10/invitations': () => json(200, []),
      'PATCH /api/groups/10': (request) => json(200, { ...plateauLab(), myRole: null, ...(request.body as object) }),
    });
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Group settings' });
    await user.clear(within(form).getByLabelText('Point limit'));
    await user.type(within(form).getByLabelText('Point limit'), '0');
    await user.click(within(form).getByRole('button', { name: 'Save group' }));
    expect(await within(form).findByText('The point limit is at least 1')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    await user.clear(within(form).getByLabelText('Point limit'));
    await user.type(within(form).getByLabelText('Point limit'), '25000');
    await user.clear(within(form).getByLabelText('Name'));
    await user.type(within(form).getByLabelText('Name'), 'Plateau Laboratory');
    await user.click(within(form).getByRole('button', { name: 'Save group' }));
    expect(await screen.findByRole('heading', { name: 'Plateau Laboratory' })).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ name: 'Plateau Laboratory', description: 'Plateau potentials and their tensor ratios', pointLimit: 25000 });
  });

  it('offers no group settings to a lead who is not a site admin', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, leadUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, plateauLab()),
      'GET /api/groups/10/invitations': () => json(200, []),
    });
    renderApp('/groups/10');
    expect(await screen.findByRole('form', { name: 'Invite someone' })).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Group settings' })).not.toBeInTheDocument();
  });
});

describe('group retention', () => {
  it('lets a lead switch retention on with the shared schema, and says it saved', async () => {
    let stored: RetentionPolicy = keptForEver;
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, leadUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, plateauLab()),
      'GET /api/groups/10/invitations': () => json(200, []),
      'GET /api/maintenance/groups/10/retention': () => json(200, stored),
      'PATCH /api/maintenance/groups/10/retention': (request) => {
        stored = request.body as RetentionPolicy;
        return json(200, stored);
      },
    });
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Retention' });
    expect(screen.getByText('Scans are kept until someone deletes them.')).toBeInTheDocument();
    expect(within(form).queryByLabelText('Keep for (days)')).not.toBeInTheDocument();

    await user.click(within(form).getByRole('checkbox', { name: 'Delete old scans automatically' }));
    const days = within(form).getByLabelText('Keep for (days)');
    expect(days).toHaveValue(90);
    await user.clear(days);
    await user.type(days, '0');
    await user.click(within(form).getByRole('checkbox', { name: 'cancelled' }));
    await user.click(within(form).getByRole('button', { name: 'Save retention' }));
    expect(await within(form).findByText('keep scans for at least 1 day')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    await user.clear(days);
    await user.type(days, '30');
    await user.click(within(form).getByRole('button', { name: 'Save retention' }));
    expect(await within(form).findByText('Saved.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ keepDays: 30, statuses: ['completed', 'failed'] });
    expect(screen.getByText('Every night, completed and failed scans older than 30 days (counted from when they finished) are archived and deleted.')).toBeInTheDocument();
  });

  it('switches retention off, keeping the statuses the API requires', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      ...otherSections({ retention: { keepDays: 14, statuses: ['failed'] } }),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: null }),
      'GET /api/groups/10/invitations': () => json(200, []),
      'PATCH /api/maintenance/groups/10/retention': (request) => json(200, request.body),
    });
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Retention' });
    expect(within(form).getByLabelText('Keep for (days)')).toHaveValue(14);
    expect(within(form).getByRole('checkbox', { name: 'failed' })).toBeChecked();
    expect(within(form).getByRole('checkbox', { name: 'completed' })).not.toBeChecked();

    await user.click(within(form).getByRole('checkbox', { name: 'Delete old scans automatically' }));
    await user.click(within(form).getByRole('button', { name: 'Save retention' }));
    expect(await within(form).findByText('Saved.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ keepDays: null, statuses: ['failed'] });
    expect(screen.getByText('Scans are kept until someone deletes them.')).toBeInTheDocument();
  });

  it('shows a member the policy without a form', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      ...otherSections({ retention: { keepDays: 180, statuses: ['cancelled', 'failed'] } }),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: 'member' }),
    });
    renderApp('/groups/10');
    expect(await screen.findByText('Every night, cancelled and failed scans older than 180 days (counted from when they finished) are archived and deleted.')).toBeInTheDocument();
    expect(screen.getByText('Only the group’s leads and site administrators can change this.')).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Retention' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save retention' })).not.toBeInTheDocument();
    expect(requests.some((r) => r.method !== 'GET')).toBe(false);
  });
});

describe('group constraint regions', () => {
  const region = (id: number, name: string, createdById: number | null): ConstraintRegion => ({
    id,
    groupId: 10,
    name,
    source: 'Invented survey DR2',
    confidenceLevel: 0.95,
    vertices: [{ ns: 0.955, r: 0 }, { ns: 0.975, r: 0 }, { ns: 0.972, r: 0.03 }, { ns: 0.958, r: 0.03 }],
    createdById,
    createdAt: '2026-12-01T10:00:00.000Z',
  });
  const csv = (text: string) => new File([text], 'survey-b.csv', { type: 'text/csv' });
  /** The group page as a member of Plateau Lab, with these routes besides. */
  const asMember = (routes: Parameters<typeof mockApi>[0] = {}) =>
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      ...otherSections(),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: 'member' }),
      ...routes,
    });

  it('uploads a region as a multipart form and lists it', async () => {
    let regions = [region(4, 'Survey A', 2)];
    const { requests } = asMember({
      'GET /api/constraint-regions': () => json(200, regions),
      'POST /api/constraint-regions': (request) => {
        const form = request.body as FormData;
        const created = { ...region(5, String(form.get('name')), 2), source: String(form.get('source')), confidenceLevel: Number(form.get('confidenceLevel')) };
        regions = [created, ...regions];
        return json(201, created);
      },
    });
    const { user } = renderApp('/groups/10');
    const table = await screen.findByRole('table', { name: 'Constraint regions' });
    expect(within(table).getByRole('row', { name: /Survey A/ })).toHaveTextContent('95% CL');

    const form = screen.getByRole('form', { name: 'Upload a constraint region' });
    await user.type(within(form).getByLabelText('Name'), 'Survey B');
    await user.type(within(form).getByLabelText('Confidence level'), '0.68');
    await user.type(within(form).getByLabelText('Source'), 'Invented survey DR3, table 4');
    await user.upload(within(form).getByLabelText('Region file (.csv, at most 1 MB)'), csv('n_s,r\n0.955,0\n0.975,0\n0.965,0.04\n'));
    await user.click(within(form).getByRole('button', { name: 'Upload region' }));

    expect(await within(form).findByText('Uploaded “Survey B” with 4 vertices.')).toBeInTheDocument();
    const sent = requests.find((r) => r.method === 'POST');
    expect(sent?.headers.get('x-sixtyfold-request')).toBe('upload');
    const body = sent?.body as FormData;
    expect(Object.fromEntries([...body.entries()].filter(([key]) => key !== 'file'))).toEqual({
      groupId: '10', name: 'Survey B', source: 'Invented survey DR3, table 4', confidenceLevel: '0.68',
    });
    expect((body.get('file') as File).name).toBe('survey-b.csv');
    expect(await within(table).findByRole('row', { name: /Survey B/ })).toHaveTextContent('68% CL');
    expect(within(form).getByLabelText('Name')).toHaveValue('');
  });

  it('checks the fields with the shared schema and asks for the file before sending', async () => {
    const { requests } = asMember();
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Upload a constraint region' });
    await user.type(within(form).getByLabelText('Confidence level'), '95');
    await user.click(within(form).getByRole('button', { name: 'Upload region' }));
    expect(await within(form).findByText('give the region a name')).toBeInTheDocument();
    expect(within(form).getByText('say where the region comes from (paper, data release)')).toBeInTheDocument();
    expect(within(form).getByText('the confidence level lies strictly between 0 and 1, e.g. 0.95')).toBeInTheDocument();
    expect(within(form).getByText('Choose the CSV file of the region’s boundary.')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('refuses a file over 1 MB before sending it', async () => {
    const { requests } = asMember();
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Upload a constraint region' });
    await user.type(within(form).getByLabelText('Name'), 'Survey B');
    await user.type(within(form).getByLabelText('Confidence level'), '0.95');
    await user.type(within(form).getByLabelText('Source'), 'Invented survey DR3');
    await user.upload(within(form).getByLabelText('Region file (.csv, at most 1 MB)'), csv(`n_s,r\n${'#'.repeat(1024 * 1024)}\n`));
    await user.click(within(form).getByRole('button', { name: 'Upload region' }));
    expect(await within(form).findByText('The file is 1.0 MB; a region file has at most 1 MB.')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('shows the line of a refused file', async () => {
    asMember({
      'POST /api/constraint-regions': () => apiError(400, 'line 4: n_s must lie between 0 and 2 (found 9.65)', undefined, 4),
    });
    const { user } = renderApp('/groups/10');
    const form = await screen.findByRole('form', { name: 'Upload a constraint region' });
    await user.type(within(form).getByLabelText('Name'), 'Survey B');
    await user.type(within(form).getByLabelText('Confidence level'), '0.95');
    await user.type(within(form).getByLabelText('Source'), 'Invented survey DR3');
    await user.upload(within(form).getByLabelText('Region file (.csv, at most 1 MB)'), csv('n_s,r\n0.955,0\n9.65,0\n0.965,0.04\n'));
    await user.click(within(form).getByRole('button', { name: 'Upload region' }));

    const alert = await within(form).findByRole('alert');
    expect(alert).toHaveTextContent('The file was refused at line 4');
    expect(alert).toHaveTextContent('n_s must lie between 0 and 2 (found 9.65)');
    expect(within(form).getByLabelText('Name')).toHaveValue('Survey B');
  });

  it('deletes a region only after confirmation, and only where the API would allow it', async () => {
    let regions = [region(4, 'Survey A', 2), region(5, 'Survey C', 7)];
    const { requests } = asMember({
      'GET /api/constraint-regions': () => json(200, regions),
      'DELETE /api/constraint-regions/4': () => {
        regions = regions.filter((r) => r.id !== 4);
        return new Response(null, { status: 204 });
      },
    });
    const { user } = renderApp('/groups/10');
    const table = await screen.findByRole('table', { name: 'Constraint regions' });
    // A member deletes the regions they uploaded, not a colleague's.
    expect(within(table).queryByRole('button', { name: 'Delete Survey C' })).not.toBeInTheDocument();

    await user.click(within(table).getByRole('button', { name: 'Delete Survey A' }));
    const dialog = await screen.findByRole('alertdialog');
    expect(dialog).toHaveTextContent('Delete the region “Survey A”?');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);

    await user.click(within(table).getByRole('button', { name: 'Delete Survey A' }));
    await user.click(within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Delete region' }));
    await waitFor(() => expect(within(table).queryByRole('row', { name: /Survey A/ })).not.toBeInTheDocument());
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.url.pathname)).toEqual(['/api/constraint-regions/4']);
    expect(within(table).getByRole('row', { name: /Survey C/ })).toBeInTheDocument();
  });

  it('shows a viewer the regions without upload or delete', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, { ...memberUser, memberships: [{ ...memberUser.memberships[0], role: 'viewer' }] }),
      ...otherSections({ regions: [region(4, 'Survey A', 2)] }),
      'GET /api/groups/10': () => json(200, { ...plateauLab(), myRole: 'viewer' }),
    });
    renderApp('/groups/10');
    const table = await screen.findByRole('table', { name: 'Constraint regions' });
    expect(within(table).getByRole('row', { name: /Survey A/ })).toBeInTheDocument();
    expect(within(table).queryByRole('button', { name: 'Delete Survey A' })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Upload a constraint region' })).not.toBeInTheDocument();
  });
});
