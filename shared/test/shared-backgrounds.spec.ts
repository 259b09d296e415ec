import { afterEach, describe, expect, it, vi } from 'vitest';
import { BackgroundSolver } from '../src/engine/background/background.js';
import { RequestEvaluator } from '../src/engine/evaluate-request.js';
import { parsePotential } from '../src/engine/expression/compile-potential.js';

// Points that differ only in N_*, in the reheating history or in a parameter that only scales V
// share one background integration; what they answer must be exactly what each point computed
// alone answers.

const grid = (method: 'slowroll' | 'exact') => [
  // An N_* axis, last (fastest), as scans order it.
  ...[1, 2, 3].flatMap((p) => [50, 55, 60].map((nStar) => ({ potential: 'monomial', params: { p }, nStar, method }))),
  // A reheating axis: w_reh and the reheating energy vary, the potential does not.
  ...[0, 1 / 3, 0.8].flatMap((w) => [1e9, 1e13].map((energyGeV) => ({ potential: 'starobinsky', reheating: { w, energyGeV }, method }))),
  // A scale axis: λ only multiplies V.
  ...[1e-12, 3e-11, 1e-10, 2e-9].map((lambda) => ({ potential: 'monomial', params: { p: 2, lambda }, nStar: 55, method })),
  // An expression with a start of its own.
  ...[45, 50, 58].map((nStar) => ({ potential: 'V0*(1-(phi/mu)^4)', params: { V0: 1e-10, mu: 10 }, phiInit: 2, nStar, method })),
  ...expressionGrid(method),
];

// A group's expression in which A only scales V (V ∝ A², detected from the expression): a scale
// axis with an N_* axis and with a reheating axis, A = 1 (the reference) among the values.
const PLATEAU = 'A^2*(1-exp(-sqrt(2/3)*phi))^2';
const expressionGrid = (method: 'slowroll' | 'exact') => [
  ...[1e-5, 3e-5, 1, 2e-6].flatMap((A) => [50, 60].map((nStar) => ({ potential: PLATEAU, params: { A }, phiInit: 7, nStar, method }))),
  ...[1e-5, 4e-5].flatMap((A) => [0, 1 / 3].map((w) => ({ potential: PLATEAU, params: { A }, phiInit: 7, reheating: { w, energyGeV: 1e10 }, method }))),
];

describe('shared backgrounds', () => {
  afterEach(() => vi.restoreAllMocks());

  it.each(['slowroll', 'exact'] as const)('%s: every point of the grid is bit for bit the point computed alone', (method) => {
    const shared = new RequestEvaluator();
    for (const request of grid(method)) {
      const alone = new RequestEvaluator().evaluate(request);
      const together = shared.evaluate(request);
      expect(alone.status).toBe('ok');
      expect(together).toEqual(alone);
    }
  });

  it('integrates one background per potential and start, not one per point', () => {
    const solve = vi.spyOn(BackgroundSolver.prototype, 'solve');
    const engine = new RequestEvaluator();
    for (const request of grid('slowroll')) engine.evaluate(request);
    // One background is kept, the last: 3 monomials, 1 Starobinsky, p = 2 again for the scale axis
    // (its four points share it), 1 hilltop, 1 for the expression's twelve points (all computed at
    // A = 1): 7 backgrounds for 34 points (the attractor check's second path is a separate solver
    // and not counted here).
    expect(solve).toHaveBeenCalledTimes(7);
  });

  it('the scale only moves the amplitude: A_s ∝ λ, the normalisation ∝ 1/λ, the rest unchanged (closed form: V → cV)', () => {
    const engine = new RequestEvaluator();
    const base = engine.evaluate({ potential: 'monomial', params: { p: 2, lambda: 1e-10 }, nStar: 55, method: 'exact' });
    const twice = engine.evaluate({ potential: 'monomial', params: { p: 2, lambda: 2e-10 }, nStar: 55, method: 'exact' });
    expect(twice.As! / base.As!).toBeCloseTo(2, 12);
    expect(base.amplitudeScale! / twice.amplitudeScale!).toBeCloseTo(2, 12);
    expect(twice.ns).toBe(base.ns);
    expect(twice.r).toBe(base.r);
    expect(twice.energyScaleGeV).toBe(base.energyScaleGeV);
    // A scale that is not positive is computed as given (and refused there).
    expect(engine.evaluate({ potential: 'monomial', params: { p: 2, lambda: -1e-10 }, nStar: 55, method: 'slowroll' }).status).toBe('negative_potential');
  });

  it.each(['slowroll', 'exact'] as const)('%s: in an expression, A_s ∝ A² and nothing else moves (closed form: V → A²V)', (method) => {
    const engine = new RequestEvaluator();
    const at = (A: number, extra: object) => engine.evaluate({ potential: PLATEAU, params: { A }, phiInit: 7, method, ...extra });
    for (const extra of [{ nStar: 55 }, { reheating: { w: 0, energyGeV: 1e10 } }]) {
      const base = at(1e-5, extra);
      const triple = at(3e-5, extra);
      expect(base.status).toBe('ok');
      expect(triple.As! / base.As!).toBeCloseTo(9, 11);
      expect(base.amplitudeScale! / triple.amplitudeScale!).toBeCloseTo(9, 11);
      for (const key of ['ns', 'r', 'alphaS', 'nStar', 'phiStar', 'energyScaleGeV', 'hubbleGeV'] as const) expect(triple[key]).toBe(base[key]);
    }
  });

  it('an expression rescaled from A = 1 agrees with the same potential computed at A directly', () => {
    const engine = new RequestEvaluator();
    // `+ 0*A` keeps A out of a bare factor, so nothing is detected and the point is computed as given.
    const direct = 'A^2*(1-exp(-sqrt(2/3)*phi))^2 + 0*A';
    for (const extra of [{ nStar: 55 }, { reheating: { w: 0, energyGeV: 1e10 } }]) {
      const request = { params: { A: 1e-5 }, phiInit: 7, method: 'exact' as const, ...extra };
      const rescaledPoint = engine.evaluate({ ...request, potential: PLATEAU });
      const directPoint = engine.evaluate({ ...request, potential: direct });
      expect(directPoint.status).toBe('ok');
      for (const key of ['As', 'amplitudeScale', 'ns', 'r', 'nStar', 'energyScaleGeV'] as const) {
        expect(Math.abs(rescaledPoint[key]! / directPoint[key]! - 1), key).toBeLessThan(1e-9);
      }
    }
    const parsedDirect = parsePotential(direct, ['A']);
    expect(parsedDirect.ok && parsedDirect.potential.scale).toBeUndefined();
    // A negative A is computed as given; V holds A², so it is the potential of A = 1e-5 (closed form).
    const negative = engine.evaluate({ potential: PLATEAU, params: { A: -1e-5 }, phiInit: 7, nStar: 55, method: 'exact' });
    const positive = engine.evaluate({ potential: PLATEAU, params: { A: 1e-5 }, phiInit: 7, nStar: 55, method: 'exact' });
    expect(Math.abs(negative.As! / positive.As! - 1)).toBeLessThan(1e-9);
    // V refused at the start quotes the user's V, not the reference's: V(1) = A·(1 − 4) = −3e-10.
    const below = engine.evaluate({ potential: 'A*(phi^2 - 4)', params: { A: 1e-10 }, phiInit: 1, nStar: 55 });
    expect(below.status).toBe('negative_potential');
    expect(below.message).toMatch(/^V\(φ_init\) = -3(\.0+)?e-10 is not positive/);
  });
});
