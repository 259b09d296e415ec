import { describe, expect, it } from 'vitest';
import { powerLawResidual } from './spectrum-shape.js';

const stencil = [-0.2, -0.1, 0, 0.1, 0.2];

describe('powerLawResidual', () => {
  it('is zero for a power law with running (closed form: ln P is quadratic in ln k)', () => {
    const lnP = stencil.map((x) => Math.log(2.1e-9) + (0.965 - 1) * x + 0.5 * -0.004 * x * x);
    expect(powerLawResidual(stencil, lnP)).toBeLessThan(1e-14);
  });

  it('is the size of a step across the stencil', () => {
    // A 15 % drop within Δ ln k = 0.5 centred on the pivot: ln P changes by ln(0.85) ≈ −0.16 across it.
    const lnP = stencil.map((x) => Math.log(2.1e-9) - 0.035 * x + 0.5 * Math.log(0.85) * (1 + Math.tanh(x / 0.125)));
    const residual = powerLawResidual(stencil, lnP);
    expect(residual).toBeGreaterThan(1e-3);
    expect(residual).toBeLessThan(0.16);
  });

  it('sees a cubic term: ln P = x³ leaves 0.2³·(12/35)… residuals of order 1e-3 at spacing 0.1', () => {
    const lnP = stencil.map((x) => x * x * x);
    const residual = powerLawResidual(stencil, lnP);
    // Closed form: the quadratic fit of x³ on symmetric points is its linear part 3.4·d²·x (Σx⁴/Σx² = 3.4 d²).
    const expected = Math.max(...stencil.map((x) => Math.abs(x ** 3 - 3.4 * 0.01 * x)));
    expect(residual).toBeCloseTo(expected, 14);
  });
});
