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
    // 3 monomials, 1 Starobinsky, 1 hilltop: 5 backgrounds for 18 points (the attractor check's
    // second path for pivots near the start is a separate solver and not counted here).
    expect(solve).toHaveBeenCalledTimes(5);
  });
});
