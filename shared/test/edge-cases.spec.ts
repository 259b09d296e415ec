import { describe, expect, it } from 'vitest';
import { RequestEvaluator } from '../src/engine/evaluate-request.js';
import { PointEvaluator } from '../src/engine/evaluate-point.js';

const engine = new RequestEvaluator();
const evaluate = (request: Record<string, unknown>) => engine.evaluate({ nStar: 50, method: 'slowroll', ...request });

describe('models that do not end inflation normally', () => {
  it('power-law inflation never ends, and says so', () => {
    const result = evaluate({ potential: 'power-law' });
    expect(result.status).toBe('no_end');
    expect(result.message).toMatch(/never will: ahead of the field the potential falls towards zero with ε_V ≤ [0-9.e-]+ < 1/);
    expect(result.ns).toBeNull();
  });

  it('a field that settles in a minimum with V > 0 is reported as trapped, with the field value', () => {
    const result = evaluate({ potential: 'V0 * (1 + 0.5 * (phi - 2)^2)', params: { V0: 1e-10 }, phiInit: 4 });
    expect(result.status).toBe('trapped');
    expect(result.message).toMatch(/local minimum at φ = 2 /);
  });

  it('with many local minima the field is trapped in the first one it reaches', () => {
    // Monodromy with Λ⁴ > μ³f has minima every 2πf; from φ = 12.6 the nearest lies within 2πf.
    const result = evaluate({ potential: 'monodromy-modulated', params: { mu3: 1e-10, Lambda4: 3e-11, f: 0.1 }, phiInit: 12.6 });
    expect(result.status).toBe('trapped');
    const phiMin = Number(/φ = ([\d.]+)/.exec(result.message)?.[1]);
    expect(Math.abs(phiMin - 12.6)).toBeLessThan(2 * Math.PI * 0.1);
    // V'(φ_min) = 0 there: μ³ = (Λ⁴/f) sin(φ/f).
    // (The message gives φ to 6 digits, so V' vanishes there only to ~3e-14 of its scale 3e-10.)
    expect(Math.abs(1e-10 - (3e-11 / 0.1) * Math.sin(phiMin / 0.1))).toBeLessThan(2e-13);
  });

  it('inflation may end on the way to a minimum', () => {
    const result = evaluate({ potential: 'double-well', params: { v: 20 } });
    expect(result.status).toBe('ok');
    expect(result.phiEnd!).toBeLessThan(20);
    expect(result.phiEnd!).toBeGreaterThan(result.phiStar!);
    // Weak modulations (Λ⁴ < μ³f) leave a monotonic potential: inflation ends as for the linear one.
    expect(evaluate({ potential: 'monodromy-modulated', params: { Lambda4: 1e-13, f: 0.1 } }).status).toBe('ok');
  });
});

describe('hilltops and extrema', () => {
  it('rolls off a hilltop in either direction with mirror-image results', () => {
    const right = evaluate({ potential: 'hilltop-quadratic', phiInit: 0.5 });
    const left = evaluate({ potential: 'hilltop-quadratic', phiInit: -0.5 });
    expect(right.status).toBe('ok');
    expect(left.status).toBe('ok');
    expect(left.ns).toBeCloseTo(right.ns!, 9);
    expect(left.phiEnd).toBeCloseTo(-right.phiEnd!, 9);
    expect(right.phiEnd!).toBeGreaterThan(0.5);
  });

  it('starting exactly on the hilltop, the field never rolls', () => {
    const result = evaluate({ potential: 'hilltop-quadratic', phiInit: 0 });
    expect(result.status).toBe('no_end');
    expect(result.message).toMatch(/V' = 0 at φ_init = 0/);
  });

  it('starting exactly in a minimum with V > 0 is trapped at once', () => {
    const result = evaluate({ potential: 'V0 * (1 + (phi - 1)^2)', params: { V0: 1e-10 }, phiInit: 1 });
    expect(result.status).toBe('trapped');
    expect(result.message).toMatch(/φ_init = 1 is a minimum/);
  });

  it('an exact inflection point (V\' = V\'\' = 0) stalls the roll; a slight tilt lets it through', () => {
    // V' = 3a(φ − 3)² → 0 as the field approaches φ = 3 on the attractor: it never gets past.
    const flat = evaluate({ potential: 'V0 * (1 + a * (phi - 3)^3)', params: { V0: 1e-10, a: 0.02 }, phiInit: 6, nStar: 5 });
    expect(flat.status).toBe('no_end');
    expect(flat.ns).toBeNull();
    const tilted = evaluate({ potential: 'V0 * (1 + a * (phi - 3)^3 + c * phi)', params: { V0: 1e-10, a: 0.02, c: 1e-3 }, phiInit: 6, nStar: 50 });
    expect(tilted.status).toBe('ok');
    expect(tilted.phiEnd!).toBeLessThan(3);
    expect(tilted.nTotal!).toBeGreaterThan(10); // the near-inflection plateau gives many e-folds
  });
});

describe('bad input and awkward numbers', () => {
  it('the overall scale of V does not change n_s, only the normalisation (1e-12 to 1e12)', () => {
    const small = evaluate({ potential: 'lambda * phi^2', params: { lambda: 1e-12 }, phiInit: 16 });
    const large = evaluate({ potential: 'lambda * phi^2', params: { lambda: 1e12 }, phiInit: 16 });
    expect(small.status).toBe('ok');
    expect(large.status).toBe('ok');
    expect(large.ns).toBeCloseTo(small.ns!, 10);
    expect((small.amplitudeScale! * 1e-12) / (large.amplitudeScale! * 1e12)).toBeCloseTo(1, 8);
    expect(large.energyScaleGeV! / small.energyScaleGeV!).toBeCloseTo(1, 8);
  });

  it('refuses NaN and Infinity in the input with a message, never NaN in the output', () => {
    const point = new PointEvaluator();
    const V = { V: (p: number) => p * p, dV: (p: number) => 2 * p, d2V: () => 2, d3V: () => 0 };
    const nan = point.evaluate({ potential: V, phiInit: NaN, nStar: 50, method: 'slowroll' });
    expect(nan.status).toBe('invalid_input');
    const inf = point.evaluate({ potential: V, phiInit: 16, nStar: Infinity, method: 'slowroll' });
    expect(inf.status).toBe('invalid_input');
    const viaRequest = evaluate({ potential: 'lambda * phi^2', params: { lambda: Infinity }, phiInit: 16 });
    expect(viaRequest.status).toBe('invalid_input');
    expect(viaRequest.message).toMatch(/params/);
  });

  it('a potential negative off the path does no harm; on the path it is reported', () => {
    // V0(1 − φ²/μ²) < 0 beyond μ = 10, but inflation ends before the field gets there.
    expect(evaluate({ potential: 'hilltop-quadratic', nStar: 50 }).status).toBe('ok');
    const below = evaluate({ potential: '1 - phi^2', params: {}, phiInit: 2 });
    expect(below.status).toBe('negative_potential');
    expect(below.message).toMatch(/is not positive/);
  });

  it('reports too few e-folds with the number available', () => {
    const result = evaluate({ potential: 'monomial', phiInit: 8, nStar: 60 });
    expect(result.status).toBe('insufficient_efolds');
    expect(result.nTotal!).toBeGreaterThan(10);
    expect(result.nTotal!).toBeLessThan(60);
    expect(result.message).toContain(`only ${Number(result.nTotal!.toPrecision(6))} e-folds`);
  });

  it('refuses a start where the field does not inflate', () => {
    const result = evaluate({ potential: 'monomial', phiInit: 0.5 });
    expect(result.status).toBe('no_inflation_at_start');
  });

  it('an expression with a mistake says where and why', () => {
    const result = evaluate({ potential: 'lambda * ph^2', params: { lambda: 1 }, phiInit: 16 });
    expect(result.status).toBe('invalid_potential');
    expect(result.message).toMatch(/Unknown symbol 'ph' at character/);
  });

  it('an expression needs phiInit; a family knows its own', () => {
    expect(evaluate({ potential: 'lambda * phi^2', params: { lambda: 1 } }).message).toMatch(/phiInit is required/);
    expect(evaluate({ potential: 'starobinsky' }).status).toBe('ok');
  });
});

describe('potentials undefined on the path', () => {
  it('a potential that stops being defined is reported as invalid there, not as NaN', () => {
    // sqrt(phi - 9) is undefined below φ = 9, which the field reaches while still inflating.
    const result = evaluate({ potential: '1 + sqrt(phi - 9)', params: {}, phiInit: 20, nStar: 5 });
    expect(result.status).toBe('invalid_potential');
    expect(result.message).toMatch(/V is not a finite number at φ = 9\.0/);
    expect(result.ns).toBeNull();
  });
});

describe('default starts of families', () => {
  it('do not depend on the overall scale, so one start serves a scan over it', () => {
    // V → λV leaves the e-fold equations unchanged: the start found for one scale is right for all.
    for (const [key, scale] of [['starobinsky', 'mu'], ['hilltop-quartic', 'V0'], ['double-well', 'lambda'], ['alpha-t', 'V0']] as const) {
      const a = new RequestEvaluator().evaluate({ potential: key, params: { [scale]: 1e-6 }, nStar: 55, method: 'slowroll' });
      const b = new RequestEvaluator().evaluate({ potential: key, params: { [scale]: 1e-2 }, nStar: 55, method: 'slowroll' });
      expect(a.phiInit).toBe(b.phiInit);
    }
  });

  it('give the same result to the last bit whichever point of a scan came first', () => {
    // Workers share the cached start across points; results must not depend on their order.
    const first = new RequestEvaluator();
    first.evaluate({ potential: 'starobinsky', params: { mu: 1e-6 }, nStar: 55, method: 'slowroll' });
    const afterOther = first.evaluate({ potential: 'starobinsky', params: { mu: 1e-4 }, nStar: 55, method: 'slowroll' });
    const alone = new RequestEvaluator().evaluate({ potential: 'starobinsky', params: { mu: 1e-4 }, nStar: 55, method: 'slowroll' });
    expect(afterOther.ns).toBe(alone.ns);
    expect(afterOther.r).toBe(alone.r);
  });
});
