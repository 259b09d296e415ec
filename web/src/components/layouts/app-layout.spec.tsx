import { screen } from '@testing-library/react';
import { adminUser, memberUser } from '@/testing/fixtures';
import { renderWithProviders } from '@/testing/render';
import { AppLayout } from './app-layout';

// `hidden: true` also counts the collapsed mobile menu, so "no Admin link" means none anywhere.
const adminLinks = () => screen.queryAllByRole('link', { name: 'Admin', hidden: true });

describe('AppLayout', () => {
  it('shows the Admin link to a site administrator', () => {
    renderWithProviders(
      <AppLayout user={adminUser} onSignOut={vi.fn()}>
        <p>page</p>
      </AppLayout>,
      { route: '/scans' },
    );
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(nav).toHaveTextContent('Admin');
    expect(adminLinks().length).toBeGreaterThan(0);
    for (const link of adminLinks()) expect(link).toHaveAttribute('href', '/admin');
  });

  it('hides the Admin link from a regular user but keeps the rest of the navigation', () => {
    renderWithProviders(
      <AppLayout user={memberUser} onSignOut={vi.fn()}>
        <p>page</p>
      </AppLayout>,
      { route: '/scans' },
    );
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(nav).toHaveTextContent('Scans');
    expect(nav).toHaveTextContent('Compare');
    expect(nav).not.toHaveTextContent('Admin');
    expect(adminLinks()).toHaveLength(0);
  });

  it('puts what it is given before the account menu in the header', () => {
    renderWithProviders(
      <AppLayout user={memberUser} onSignOut={vi.fn()} headerActions={<a href="/notifications">Bell</a>}>
        <p>page</p>
      </AppLayout>,
    );
    expect(screen.getByRole('banner')).toContainElement(screen.getByRole('link', { name: 'Bell' }));
  });

  it('marks the current page in the navigation', () => {
    renderWithProviders(
      <AppLayout user={memberUser} onSignOut={vi.fn()}>
        <p>page</p>
      </AppLayout>,
      { route: '/models' },
    );
    const nav = screen.getByRole('navigation', { name: 'Main' });
    const current = nav.querySelector('[aria-current="page"]');
    expect(current).toHaveTextContent('Models');
  });

  it('lists groups with roles in the user menu and signs out from it', async () => {
    const onSignOut = vi.fn();
    const { user } = renderWithProviders(
      <AppLayout user={adminUser} onSignOut={onSignOut}>
        <p>page</p>
      </AppLayout>,
    );
    await user.click(screen.getByRole('button', { name: 'Account menu for Amara Okafor' }));

    const lab = await screen.findByRole('menuitem', { name: /Plateau Lab/ });
    expect(lab).toHaveTextContent('lead');
    expect(lab).toHaveAttribute('href', '/groups/10');
    expect(screen.getByRole('menuitem', { name: /Reheating Club/ })).toHaveTextContent('viewer');

    expect(screen.getByRole('menuitem', { name: 'Notifications' })).toHaveAttribute('href', '/notifications');
    expect(screen.getByRole('menuitem', { name: 'Preferences' })).toHaveAttribute('href', '/preferences');

    await user.click(screen.getByRole('menuitem', { name: 'Sign out' }));
    expect(onSignOut).toHaveBeenCalledTimes(1);
  });
});
