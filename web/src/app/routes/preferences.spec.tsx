import { screen, waitFor } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

vi.setConfig({ testTimeout: 20_000 });
const slow = { timeout: 5_000 };

describe('preferences page', () => {
  it('shows the stored e-mail choice and saves a new one with a confirmation', async () => {
    let stored = 'immediate';
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/auth/me/preferences': () => json(200, { notificationEmail: stored }),
      'PATCH /api/auth/me/preferences': (request: MockRequest) => {
        stored = (request.body as { notificationEmail: string }).notificationEmail;
        return json(200, { notificationEmail: stored });
      },
    });
    const { user } = renderApp('/preferences');

    const atOnce = await screen.findByRole('radio', { name: /At once/ }, slow);
    expect(atOnce).toBeChecked();
    expect(screen.getByRole('radio', { name: /Daily digest/ })).not.toBeChecked();
    await user.click(screen.getByRole('radio', { name: /Daily digest/ }));
    await user.click(screen.getByRole('button', { name: 'Save preferences' }));

    expect(await screen.findByRole('status', undefined, slow)).toHaveTextContent('Saved');
    expect(screen.getByRole('radio', { name: /Daily digest/ })).toBeChecked();
    expect(requests.filter((r) => r.method === 'PATCH').map((r) => r.body)).toEqual([{ notificationEmail: 'daily' }]);
  });

  it('says when saving failed', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/auth/me/preferences': () => json(200, { notificationEmail: 'daily' }),
      'PATCH /api/auth/me/preferences': () => apiError(503, 'The database is busy'),
    });
    const { user } = renderApp('/preferences');
    await user.click(await screen.findByRole('radio', { name: /Never/ }, slow));
    await user.click(screen.getByRole('button', { name: 'Save preferences' }));
    const alert = await screen.findByRole('alert', undefined, slow);
    expect(alert).toHaveTextContent('Could not save your preferences');
    expect(alert).toHaveTextContent('The database is busy');
    await waitFor(() => expect(screen.queryByText('Saved')).not.toBeInTheDocument());
  });
});
