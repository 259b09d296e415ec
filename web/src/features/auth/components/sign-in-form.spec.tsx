import { screen, waitFor } from '@testing-library/react';
import { adminUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { SignInForm } from './sign-in-form';

describe('SignInForm', () => {
  it('shows a field error for a malformed e-mail and does not call the API', async () => {
    const { fetchMock } = mockApi({});
    const { user } = renderWithProviders(<SignInForm onSuccess={vi.fn()} />);

    await user.type(screen.getByLabelText('E-mail'), 'amara.okafor');
    await user.type(screen.getByLabelText('Password'), 'inflaton-demo-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter an e-mail address like name@institute.example')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('posts the normalised credentials as JSON and hands the user to onSuccess', async () => {
    const { requests } = mockApi({ 'POST /api/auth/login': () => json(200, adminUser) });
    const onSuccess = vi.fn();
    const { user } = renderWithProviders(<SignInForm onSuccess={onSuccess} />);

    await user.type(screen.getByLabelText('E-mail'), '  Amara.Okafor@Halvorsen.example ');
    await user.type(screen.getByLabelText('Password'), 'inflaton-demo-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(onSuccess).toHaveBeenCalledWith(adminUser));
    expect(requests).toHaveLength(1);
    const [request] = requests;
    expect(request.method).toBe('POST');
    expect(request.url.pathname).toBe('/api/auth/login');
    expect(request.headers.get('content-type')).toBe('application/json');
    expect(request.credentials).toBe('same-origin');
    expect(request.body).toEqual({ email: 'amara.okafor@halvorsen.example', password: 'inflaton-demo-1' });
  });

  it("shows the API's message when the password is wrong", async () => {
    mockApi({ 'POST /api/auth/login': () => apiError(401, 'E-mail or password is wrong') });
    const onSuccess = vi.fn();
    const { user } = renderWithProviders(<SignInForm onSuccess={onSuccess} />);

    await user.type(screen.getByLabelText('E-mail'), 'amara.okafor@halvorsen.example');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('E-mail or password is wrong')).toBeInTheDocument();
    expect(screen.getByRole('alert')).toHaveTextContent('E-mail or password is wrong');
    expect(onSuccess).not.toHaveBeenCalled();
  });

  it('says so when the account is disabled', async () => {
    const message = 'Account disabled: a site administrator has disabled this account and can re-enable it';
    mockApi({ 'POST /api/auth/login': () => apiError(403, message) });
    const onSuccess = vi.fn();
    const { user } = renderWithProviders(<SignInForm onSuccess={onSuccess} />);

    await user.type(screen.getByLabelText('E-mail'), 'amara.okafor@halvorsen.example');
    await user.type(screen.getByLabelText('Password'), 'the-right-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent(message);
    expect(alert).toHaveTextContent('Ask a site administrator');
    expect(onSuccess).not.toHaveBeenCalled();
  });

  it('asks the user to wait when sign-in is throttled', async () => {
    const message = 'Too many sign-in attempts for this account (at most 10 in 60 s, from anywhere); try again in 42 s';
    mockApi({ 'POST /api/auth/login': () => apiError(429, message) });
    const { user } = renderWithProviders(<SignInForm onSuccess={vi.fn()} />);

    await user.type(screen.getByLabelText('E-mail'), 'amara.okafor@halvorsen.example');
    await user.type(screen.getByLabelText('Password'), 'again');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Too many attempts, wait a minute')).toBeInTheDocument();
    expect(screen.getByText(message)).toBeInTheDocument();
  });

  it("puts the API's per-field errors next to the fields", async () => {
    mockApi({
      'POST /api/auth/login': () => apiError(400, 'Validation failed', { password: ['Passwords are at most 200 characters'] }),
    });
    const { user } = renderWithProviders(<SignInForm onSuccess={vi.fn()} />);

    await user.type(screen.getByLabelText('E-mail'), 'amara.okafor@halvorsen.example');
    await user.type(screen.getByLabelText('Password'), 'x');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Passwords are at most 200 characters')).toBeInTheDocument();
    expect(screen.getByLabelText('Password')).toHaveAttribute('aria-invalid', 'true');
  });
});
