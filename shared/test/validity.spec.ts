import { describe, expect, it } from 'vitest';
import { RequestEvaluator } from '../src/engine/evaluate-request.js';
import { findFamily } from '../src/engine/families/potential-families.js';
import { SLOW_ROLL_REGIME, slowRollEfolds } from '../src/engine/observables/slow-roll.js';
import { compile } from './support/compile.js';

const engine = new RequestEvaluator();
const evaluate = (request: Record<string, unknown>) => engine.evaluate({ nStar: 55, method: 'exact', ...request });
const hilltop = (mu: number) => ({ potential: 'V0*(1-(phi/mu)^4)', params: { V0: 1e-10, mu } });

describe('long inflation ends whenever it ends: no cap on e-folds', () => {
  it('hilltop quartic μ = 10 from φ = 0.5 inflates ~4,978 e-folds and gives the same n_s as from φ = 2', () => {
    const far = evaluate({ ...hilltop(10), phiInit: 0.5 });
    const near = evaluate({ ...hilltop(10), phiInit: 2 });
    expect(far.status).toBe('ok');
    // Independent integration of the same equations at tight tolerance: N_total = 4,978, n_s = 0.958608.
    expect(far.nTotal!).toBeCloseTo(4978, -1);
    expect(Math.abs(far.ns! - 0.958608)).toBeLessThan(6e-6);
    expect(Math.abs(far.ns! - near.ns!)).toBeLessThan(1e-6);
  });

  it.each([
    [20, 2],
    [5, 0.18],
  ])('hilltop quartic μ = %s from φ = %s is answered, not called endless', (mu, phiInit) => {
    const result = evaluate({ ...hilltop(mu), phiInit });
    expect(result.status).toBe('ok');
    // Slow roll near the top (closed form): N ≈ μ⁴/(8φ²) e-folds from φ, far beyond the old cap of 2,000.
    expect(result.nTotal!).toBeGreaterThan(0.9 * (mu ** 4 / (8 * phiInit ** 2)));
  });

  it('power-law inflation never ends, and the reason is the potential ahead of the field', () => {
    const result = evaluate({ potential: 'power-law', method: 'slowroll' });
    expect(result.status).toBe('no_end');
    expect(result.message).toMatch(/never will: ahead of the field the potential falls towards zero with ε_V ≤ [\d.e-]+ < 1/);
  });

  it('a field approaching an exact inflection point (V\' = V\'\' = 0) never gets past it', () => {
    const result = evaluate({ potential: 'V0 * (1 + a * (phi - 3)^3)', params: { V0: 1e-10, a: 0.02 }, phiInit: 6, nStar: 5, method: 'slowroll' });
    expect(result.status).toBe('no_end');
    // Closed form: V' = 3a V0 (φ − 3)² vanishes at φ = 3 without changing sign.
    expect(result.message).toMatch(/V' vanishes at φ = 3 ahead of the field .* without changing sign/);
  });

  it('a plateau that flattens for ever is endless; one that steepens again ends', () => {
    const flat = evaluate({ potential: 'V0*(1+exp(-phi))', params: { V0: 1e-10 }, phiInit: 1, method: 'slowroll' });
    expect(flat.status).toBe('no_end');
    expect(flat.message).toMatch(/flat stretch/);
    // The same reading at any height: where e^{−φ} fades through the subnormals, |V'/V| stays level
    // for a few samples, which is no minimum of the slope (no V' = 0 to refine).
    for (const height of ['1', '1e-10', '1e-100']) {
      const plateau = evaluate({ potential: `${height}*(1+exp(-phi))`, phiInit: 1, method: 'slowroll' });
      expect(plateau.message, height).toMatch(/V'\/V is zero to double precision from φ = [\d.]+ on, .* flat stretch/);
    }
    // The same plateau with a slight tilt downhill ahead: ε_V reaches 1 far ahead, so it keeps integrating.
    const tilted = compile('1 + exp(-phi) - 1e-3 * phi', {});
    expect(slowRollEfolds(tilted, 1, 900)).toBeGreaterThan(1000);
  });
});

describe('enough history before the pivot', () => {
  // V = φ²/2 from φ = 11.2: N_total = (11.2² − φ_end²)/4 ≈ 31.8 (closed form, slow roll).
  const quadratic = { potential: '0.5*phi^2', params: {}, phiInit: 11.2, method: 'slowroll' };

  it('a pivot 2.3 e-folds after the start is refused, saying what is needed and what is available', () => {
    const result = evaluate({ ...quadratic, nStar: 29.5 });
    expect(result.status).toBe('pivot_too_early');
    expect(result.message).toMatch(/about 3 e-folds of history before the pivot are needed, 2\.3\d* available/);
    expect(result.ns).toBeNull();
  });

  it('3.3 e-folds of slow roll are enough: the start is forgotten by e^{−3ΔN}', () => {
    const result = evaluate({ ...quadratic, nStar: 28.5 });
    expect(result.status).toBe('ok');
  });

  it('for a built-in family the engine moves the start up itself', () => {
    const result = evaluate({ potential: 'monomial', params: { p: 2 }, nStar: 200, method: 'slowroll' });
    expect(result.status).toBe('ok');
    const family = findFamily('monomial')!;
    const defaultStart = family.phiInit({ p: 2 }, compile('phi^2', {}));
    expect(result.phiInit!).toBeGreaterThan(defaultStart);
    // Slow roll for V ∝ φ² (closed form): n_s = 1 − 2/(N_* + 1/2) to first order.
    expect(result.ns!).toBeCloseTo(1 - 2 / 200.5, 3);
  });

  it('a family whose start would have to sit on its hilltop says so', () => {
    // Hilltop quadratic with μ = 0.5: η_V = −2/μ² = −8 at the top (closed form), so 75 slow-roll e-folds need φ ~ e^{−8·75/2}.
    const result = evaluate({ potential: 'hilltop-quadratic', params: { mu: 0.5 }, method: 'slowroll' });
    expect(result.status).toBe('insufficient_efolds');
    expect(result.message).toMatch(/\|η_V\| = 8 at the top\) needs the field at φ = [\d.]+e-\d+, where V'\/V = .* is below the 1e-14 the engine resolves/);
  });

  describe('a field arriving on a plateau from a steep side', () => {
    // 6x² − 8(1 − b)x³ + 3x⁴ with x = φ/v has a near-inflection at x = 1 (V' ∝ 12x(1 − x)² + 24bx²).
    const shape = (b: number, v: number) => ({
      potential: 'V0*(6*(phi/v)^2 - 8*(1-b)*(phi/v)^3 + 3*(phi/v)^4)',
      params: { V0: 1e-10, b, v },
    });

    it('a pause of inflation on the steep side (ε_H = 1, then inflation resumes) is passed over', () => {
      const steep = evaluate({ ...shape(1e-4, 2.2), phiInit: 4.4, nStar: 50 });
      const gentle = evaluate({ ...shape(1e-4, 2.2), phiInit: 2.86, nStar: 50 });
      expect(steep.status).toBe('ok');
      expect(gentle.status).toBe('ok');
      expect(Math.abs(steep.ns! - gentle.ns!)).toBeLessThan(1e-6);
    });

    it('a pivot in the ultra-slow roll after the arrival is refused; a later one agrees between starts', () => {
      const nTotal = evaluate({ ...shape(1e-4, 2.2), phiInit: 4.4, nStar: 50 }).nTotal!;
      const early = evaluate({ ...shape(1e-4, 2.2), phiInit: 4.4, nStar: nTotal - 4 });
      expect(early.status).toBe('pivot_too_early');
      expect(early.message).toMatch(/not yet on its attractor/);
      const later = evaluate({ ...shape(1e-4, 2.2), phiInit: 4.4, nStar: nTotal - 14 });
      const fromHigher = evaluate({ ...shape(1e-4, 2.2), phiInit: 6.6, nStar: nTotal - 14 });
      expect(later.status).toBe('ok');
      // Once the pivot is on the attractor, where the field started no longer matters.
      expect(Math.abs(later.ns! - fromHigher.ns!)).toBeLessThan(1e-5);
    });

    it('an overshoot is told the field arrives too fast, not to start further up', () => {
      const result = evaluate({ ...shape(1e-9, 0.3), phiInit: 0.315, method: 'slowroll' });
      expect(result.status).toBe('insufficient_efolds');
      expect(result.message).toMatch(/where slow roll would give 52\d\.\d+: the field arrives too fast/);
      expect(result.message).toMatch(/Start lower/);
      expect(result.message).not.toMatch(/start further up/);
    });
  });
});

describe('slow roll is refused outside its regime', () => {
  it.each([
    ['phi^2*(1+1e-9*sin(1e7*phi))', 16],
    ['phi^2*(1+1e-5*sin(1e4*phi))', 16],
  ])('%s from φ = %s is slow_roll_invalid, with the numbers', (potential, phiInit) => {
    const result = evaluate({ potential, phiInit, method: 'slowroll' });
    expect(result.status).toBe('slow_roll_invalid');
    expect(result.message).toMatch(/\|η_V\| = [\d.e+]+ > 0\.2/);
    expect(result.ns).toBeNull();
  });

  it('a step at the pivot is slow_roll_invalid', () => {
    // m²φ²/2 (1 + c tanh((φ − φ_s)/d)) with c = 1e-3, d = 0.02 and φ_s at the pivot of the plain φ².
    const plain = evaluate({ potential: '0.5*phi^2', phiInit: 16, method: 'slowroll' });
    const phis = plain.phiStar!;
    const result = evaluate({ potential: `0.5*phi^2*(1 + 1e-3*tanh((phi - ${phis})/0.02))`, phiInit: 16, method: 'slowroll' });
    expect(result.status).toBe('slow_roll_invalid');
  });

  it('every smooth built-in family at its default parameters and N_* = 50 and 60 stays inside the regime', () => {
    for (const key of ['monomial', 'quadratic-quartic', 'starobinsky', 'natural', 'hilltop-quadratic', 'hilltop-quartic', 'alpha-t', 'alpha-e', 'double-well']) {
      for (const nStar of [50, 60]) {
        expect(evaluate({ potential: key, nStar, method: 'slowroll' }).status, `${key} N_*=${nStar}`).toBe('ok');
      }
    }
    // The steepest of them, p = 6 at N_* = 50: ε_V ≈ p/(4N) = 0.03 (closed form), a third of the bound.
    expect(evaluate({ potential: 'monomial', params: { p: 6 }, nStar: 50, method: 'slowroll' }).status).toBe('ok');
    expect(SLOW_ROLL_REGIME.epsilonV).toBeGreaterThan(3 * 0.03);
  });

  it('the exact method is not bound by slow roll: the same modulated point is answered', () => {
    const result = evaluate({ potential: 'phi^2*(1+1e-9*sin(1e7*phi))', phiInit: 16, method: 'exact' });
    expect(result.status).not.toBe('slow_roll_invalid');
  });
});
