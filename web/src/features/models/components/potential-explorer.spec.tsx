import { configure, screen, waitFor, within } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

// These pages parse and differentiate a potential and run the engine inline on the test's thread.
configure({ asyncUtilTimeout: 10_000 });
vi.setConfig({ testTimeout: 30_000 });

// Starobinsky at N_* = 55 to first order in slow roll, with the end of inflation at ε_V = 1:
// n_s = 0.96498, r = 0.00350. The engine ends inflation where ε_H = 1 and counts the exact
// e-folds back to the pivot, which shifts the slow-roll count by about one to one and a half
// e-folds. With dn_s/dN = 2/N² and dr/dN = −24/N³ at N = 55, two e-folds of slack are
// ±0.0013 in n_s and ±0.0003 in r.
const N = 55;
const NS_TOLERANCE = (2 * 2) / N ** 2;
const R_TOLERANCE = (2 * 24) / N ** 3;

const SUPERSCRIPTS: Record<string, string> = { '⁻': '-', '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9' };

/** The number shown for one result, read back from "0.96403" or "−6.55 × 10⁻⁴". */
function statValue(results: HTMLElement, label: string): number {
  const term = within(results).getByText(label, { selector: 'dt' });
  const text = (term.nextElementSibling?.textContent ?? '').replace(/−/g, '-');
  const [mantissa, power] = text.split(' × 10');
  const exponent = power ? Number([...power].map((c) => SUPERSCRIPTS[c] ?? c).join('')) : 0;
  return Number(mantissa) * 10 ** exponent;
}

describe('family page', () => {
  beforeEach(() => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser) });
  });

  it('runs a slow-roll trial for Starobinsky at N_* = 55 in the browser and shows n_s and r', async () => {
    renderApp('/models/families/starobinsky');

    expect(await screen.findByRole('heading', { level: 1, name: 'Starobinsky R² (Einstein frame)' })).toBeInTheDocument();
    const results = await screen.findByRole('region', { name: 'Trial results' });
    expect(Math.abs(statValue(results, 'n_s') - 0.96498)).toBeLessThan(NS_TOLERANCE);
    expect(Math.abs(statValue(results, 'r') - 0.0035)).toBeLessThan(R_TOLERANCE);
    expect(screen.getByText(/Computed in \d+ ms in your browser/)).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /φ against e-folds N/ })).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /ε_H against e-folds N/ })).toBeInTheDocument();
  });
});

describe('trial errors', () => {
  beforeEach(() => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser) });
  });

  it("shows the engine's own message when it cannot evaluate the point", async () => {
    // Power-law inflation never ends: the engine says why, whatever N_* is asked.
    const { user } = renderApp('/models/families/power-law');
    const first = await screen.findByRole('alert', {}, { timeout: 15_000 });
    expect(first).toHaveTextContent('The engine could not evaluate this point');
    expect(first).toHaveTextContent(/never will/);

    const nStar = screen.getByLabelText('N_*');
    await user.clear(nStar);
    await user.type(nStar, '500');
    await user.click(screen.getByRole('button', { name: 'Run trial' }));
    await waitFor(() => expect(screen.getByRole('alert')).toHaveTextContent(/never will/), { timeout: 15_000 });
    expect(screen.queryByRole('region', { name: 'Trial results' })).not.toBeInTheDocument();
  });

  it('says which parameter only scales V, or that none does', async () => {
    const { unmount } = renderApp('/models/families/starobinsky');
    expect(await screen.findByText('mu (V ∝ mu²): points that differ only in mu, N_* or the reheating share one background integration')).toBeInTheDocument();
    unmount();
    renderApp('/models/families/quadratic-quartic');
    expect(
      await screen.findByText('none: no parameter only scales V, so only points that differ in N_* or the reheating share one background integration'),
    ).toBeInTheDocument();
  });

  it('asks for a number instead of plotting or running with an empty parameter', async () => {
    const { user } = renderApp('/models/families/natural');
    const f = await screen.findByLabelText('f');
    await user.clear(f);

    expect(screen.getByText('Enter a number for f, e.g. 7')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Run trial' })).toBeDisabled();
    expect(screen.queryByRole('img', { name: /V\(φ\) above/ })).not.toBeInTheDocument();
  });

  it('plots over the range typed in, refuses an empty one, and fits it to the roll again', async () => {
    const { user } = renderApp('/models/families/starobinsky');
    const phiMax = await screen.findByLabelText('φ max');
    expect(screen.getByRole('img', { name: /V\(φ\) above/ })).toBeInTheDocument();
    const fitted = (phiMax as HTMLInputElement).value;

    await user.clear(phiMax);
    await user.type(phiMax, '-1');
    expect(screen.getByRole('alert')).toHaveTextContent('φ max must be larger than φ min');
    expect(screen.queryByRole('img', { name: /V\(φ\) above/ })).not.toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Fit range to the roll' }));
    expect(screen.getByLabelText('φ max')).toHaveValue(fitted);
    expect(screen.getByRole('img', { name: /V\(φ\) above/ })).toBeInTheDocument();
  });
});
