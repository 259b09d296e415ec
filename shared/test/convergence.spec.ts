import { describe, expect, it } from 'vitest';
import { BackgroundSolver, DEFAULT_BACKGROUND_OPTIONS } from '../src/engine/background/background.js';
import { PointEvaluator, type PointResult } from '../src/engine/evaluate-point.js';
import { compile as compiled } from './support/compile.js';
import { potentialSlowRoll } from '../src/engine/observables/slow-roll.js';

const starobinsky = compiled('0.75 * (1 - exp(-sqrt(2/3) * phi))^2', {});
const quadratic = compiled('0.5 * m^2 * phi^2', { m: 6e-6 });

function exact(modes: Record<string, number>, potential = starobinsky, phiInit = 5.8): PointResult {
  const result = new PointEvaluator(modes).evaluate({ potential, phiInit, nStar: 55, method: 'exact' });
  if (result.status !== 'ok') throw new Error(result.message);
  return result;
}

describe('background', () => {
  it('locates the end of inflation at ε_H = 1 to 1e-10 in N', () => {
    const solver = new BackgroundSolver();
    for (const tolerance of [1e-10, 1e-12]) {
      const bg = solver.solve(starobinsky, 5.8, { ...DEFAULT_BACKGROUND_OPTIONS, tolerance });
      if (bg.status !== 'ok') throw new Error(bg.message);
      expect(Math.abs(0.5 * bg.piEnd * bg.piEnd - 1)).toBeLessThan(1e-12);
    }
    const fine = solver.solve(starobinsky, 5.8, { ...DEFAULT_BACKGROUND_OPTIONS, tolerance: 1e-13 });
    const finer = solver.solve(starobinsky, 5.8, { ...DEFAULT_BACKGROUND_OPTIONS, tolerance: 1e-14 });
    if (fine.status !== 'ok' || finer.status !== 'ok') throw new Error('background failed');
    expect(Math.abs(fine.nEnd - finer.nEnd)).toBeLessThan(1e-10);
  });

  it('the default tolerance puts N_end within 1e-6 of the converged value', () => {
    const solver = new BackgroundSolver();
    const reference = solver.solve(quadratic, 16, { ...DEFAULT_BACKGROUND_OPTIONS, tolerance: 1e-13 });
    if (reference.status !== 'ok') throw new Error('background failed');
    const nRef = reference.nEnd;
    const standard = solver.solve(quadratic, 16);
    if (standard.status !== 'ok') throw new Error('background failed');
    expect(Math.abs(standard.nEnd - nRef)).toBeLessThan(1e-6);
    // φ_end for φ² at ε_H = 1 is 1.0093 (slow roll would say √2): derived check value.
    expect(standard.phiEnd).toBeCloseTo(1.0093, 4);
  });
});

describe('slowroll reproduces its own definition', () => {
  it('n_s, r, α_s equal the first-order formulas at the converged φ_* to 1e-6', () => {
    const point = new PointEvaluator();
    const result = point.evaluate({ potential: starobinsky, phiInit: 5.8, nStar: 55, method: 'slowroll' });
    const converged = point.evaluate({ potential: starobinsky, phiInit: 5.8, nStar: 55, method: 'slowroll', tolerance: 1e-13 });
    if (result.status !== 'ok' || converged.status !== 'ok') throw new Error('failed');
    const formula = potentialSlowRoll(starobinsky, converged.phiStar);
    // Closed forms for V = ¾(1 − e^{−x})², x = √(2/3)φ: ε = (4/3) e^{−2x}/(1 − e^{−x})², η = (4/3)(2e^{−2x} − e^{−x})/(1 − e^{−x})².
    const y = Math.exp(-Math.sqrt(2 / 3) * converged.phiStar);
    const eps = ((4 / 3) * y * y) / (1 - y) ** 2;
    const eta = ((4 / 3) * (2 * y * y - y)) / (1 - y) ** 2;
    expect(Math.abs(formula.ns - (1 - 6 * eps + 2 * eta))).toBeLessThan(1e-12);
    expect(Math.abs(result.ns - formula.ns)).toBeLessThan(1e-6);
    expect(Math.abs(result.r - formula.r)).toBeLessThan(1e-6);
    expect(Math.abs(result.alphaS - formula.alphaS)).toBeLessThan(1e-6);
  });
});

describe('exact method: convergence of every numerical choice', () => {
  const reference = exact({ startDepth: 400, endDepth: 1e-5, tolerance: 1e-11, stencil: 0.25 });

  it('start depth: the error falls at least as 1/K² and is below 1e-5 by K = 50 (default 30)', () => {
    const err = (K: number) => Math.abs(exact({ startDepth: K, tolerance: 1e-11 }).As / reference.As - 1);
    const e25 = err(25);
    const e50 = err(50);
    expect(e25 / e50).toBeGreaterThan(3.5);
    expect(e50).toBeLessThan(1e-5);
    expect(Math.abs(exact({ startDepth: 50, tolerance: 1e-11 }).ns - reference.ns)).toBeLessThan(1e-6);
  });

  it('end depth: frozen modes, P changes by < 1e-6 from k/aH = 1e-3 to 1e-5', () => {
    const early = exact({ endDepth: 1e-2, tolerance: 1e-11 });
    const standard = exact({ endDepth: 1e-3, tolerance: 1e-11 });
    const late = exact({ endDepth: 1e-5, tolerance: 1e-11 });
    expect(Math.abs(standard.As / late.As - 1)).toBeLessThan(1e-6);
    expect(Math.abs(early.As / late.As - 1)).toBeGreaterThan(Math.abs(standard.As / late.As - 1));
  });

  it('tolerance: the default meets the accuracy goals against a tight reference', () => {
    const standard = exact({});
    expect(Math.abs(standard.ns - reference.ns)).toBeLessThan(1e-5);
    expect(Math.abs(standard.alphaS - reference.alphaS)).toBeLessThan(1e-5);
    expect(Math.abs(standard.r / reference.r - 1)).toBeLessThan(1e-3);
    expect(Math.abs(standard.As / reference.As - 1)).toBeLessThan(1e-3);
  });

  it('stencil: n_s and α_s do not depend on the ln k spacing beyond 1e-5', () => {
    for (const stencil of [0.1, 0.5]) {
      const other = exact({ stencil, tolerance: 1e-11 });
      expect(Math.abs(other.ns - reference.ns)).toBeLessThan(1e-5);
      expect(Math.abs(other.alphaS - reference.alphaS)).toBeLessThan(1e-5);
    }
  });

  it('normalisation: aH = k_* at the pivot, so P_R(k_*) is the second-order slow-roll amplitude there', () => {
    // Stewart & Lyth 1993: P = H²/(8π²ε₁)[1 − 2(C+1)ε₁ − Cε₂] at k = aH; a pivot misplaced by δN
    // would shift P by (n_s − 1)δN ≈ 3.5e-2 per e-fold.
    for (const [potential, phiInit] of [[starobinsky, 5.8], [quadratic, 16]] as const) {
      const point = exact({}, potential, phiInit);
      expect(Math.abs(point.As / point.secondOrder.As - 1)).toBeLessThan(1e-3);
    }
  });
});
