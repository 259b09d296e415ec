import { describe, expect, it } from 'vitest';
import { CashKarpStepper, hermite } from './cash-karp.js';

// y' = −y, y(0) = 1: the analytic solution e^{−t} (common practice as a convergence problem).
const decay = (out: Float64Array, y: Float64Array) => {
  out[0] = -y[0];
};

function errorWithFixedStep(h: number): number {
  // A tolerance no step can fail makes the adaptive integrator take fixed steps of maxStep.
  const s = new CashKarpStepper(1, decay, { tolerance: 1e3, maxStep: h });
  s.reset(0, [1], h);
  while (s.t < 1 - 1e-12) expect(s.step(1)).toBe('ok');
  return Math.abs(s.y[0] - Math.exp(-1));
}

describe('CashKarpStepper', () => {
  it('converges at fifth order (Cash & Karp 1990: the propagated solution is the 5th-order one)', () => {
    const e1 = errorWithFixedStep(0.2);
    const e2 = errorWithFixedStep(0.1);
    const order = Math.log2(e1 / e2);
    expect(order).toBeGreaterThan(4.6);
    expect(order).toBeLessThan(5.6);
  });

  it('meets its tolerance adaptively and never touches the caller\'s array', () => {
    const s = new CashKarpStepper(1, decay, { tolerance: 1e-12, maxStep: 1 });
    const y0 = new Float64Array([1]);
    s.reset(0, y0, 0.1);
    while (s.t < 5) expect(s.step(5)).toBe('ok');
    expect(s.y[0]).toBeCloseTo(Math.exp(-5), 11);
    expect(y0[0]).toBe(1);
    expect(s.evaluations).toBeGreaterThan(0);
  });

  it('interpolates inside the last step and re-steps exactly onto an interior time', () => {
    const s = new CashKarpStepper(1, decay, { tolerance: 1e-12, maxStep: 0.5 });
    s.reset(0, [1], 0.5);
    s.step(0.5);
    s.computeDerivative();
    const mid = 0.5 * (s.tPrev + s.t);
    expect(Math.abs(hermite(s, 0, mid) - Math.exp(-mid))).toBeLessThan(1e-5); // O(h⁴) interpolant
    expect(s.restepTo(mid)).toBe('ok');
    expect(s.y[0]).toBeCloseTo(Math.exp(-mid), 11);
  });

  it('reports non-finite values as a status instead of throwing', () => {
    const blowUp = (out: Float64Array, y: Float64Array) => {
      out[0] = y[0] > 2 ? NaN : y[0] * y[0];
    };
    const s = new CashKarpStepper(1, blowUp, { tolerance: 1e-8, maxStep: 0.1 });
    s.reset(0, [1], 0.01);
    let result = 'ok';
    for (let i = 0; i < 1000 && result === 'ok'; i++) result = s.step(10);
    expect(result).toBe('non_finite');
  });
});
