import { afterEach, describe, expect, it, vi } from 'vitest';
import { BackgroundSolver } from '../src/engine/background/background.js';
import { RequestEvaluator } from '../src/engine/evaluate-request.js';

// Points that differ only in N_* or in the reheating history share one background integration;
// what they answer must be exactly what each point computed alone answers.

const grid = (method: 'slowroll' | 'exact') => [
  // An N_* axis, last (fastest), as scans order it.
  ...[1, 2, 3].flatMap((p) => [50, 55, 60].map((nStar) => ({ potential: 'monomial', params: { p }, nStar, method }))),
  // A reheating axis: w_reh and the reheating energy vary, the potential does not.
  ...[0, 1 / 3, 0.8].flatMap((w) => [1e9, 1e13].map((energyGeV) => ({ potential: 'starobinsky', reheating: { w, energyGeV }, method }))),
  // A scale axis: λ only multiplies V.
  ...[1e-12, 3e-11, 1e-10, 2e-9].map((lambda) => ({ potential: 'monomial', params: { p: 2, lambda }, nStar: 55, method })),
  // An expression with a start of its own.
  ...[45, 50, 58].map((nStar) => ({ potential: 'V0*(1-(phi/mu)^4)', params: { V0: 1e-10, mu: 10 }, phiInit: 2, nStar, method })),
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
    // (its four points share it), 1 hilltop: 6 backgrounds for 22 points (the attractor check's
    // second path is a separate solver and not counted here).
    expect(solve).toHaveBeenCalledTimes(6);
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
});
