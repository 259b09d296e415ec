import { describe, expect, it } from 'vitest';
import { BackgroundSolver, DEFAULT_BACKGROUND_OPTIONS } from '../src/engine/background/background.js';
import { BudgetMeter } from '../src/engine/budget.js';
import { PointEvaluator } from '../src/engine/evaluate-point.js';
import { RequestEvaluator } from '../src/engine/evaluate-request.js';
import { compile } from './support/compile.js';

const engine = new RequestEvaluator();
const evaluate = (request: Record<string, unknown>, on = engine) => on.evaluate({ nStar: 55, method: 'exact', ...request });
// A small budget: the settling cases below must be answered well within it.
const frugal = new RequestEvaluator({ budget: { evaluations: 200_000, steps: 2_000 } });
const minimumIn = (message: string) => Number(/local minimum at φ = ([-\d.e]+)/.exec(message)?.[1]);

describe('a field settling into a minimum with V > 0', () => {
  const shallow = 'V0 * (1 + 0.1 * (phi - 3)^2)';

  it.each([10, 3.5, -4])(`"${shallow}" from φ = %s settles without oscillating and is trapped at φ = 3`, (phiInit) => {
    const result = evaluate({ potential: shallow, params: { V0: 1e-10 }, phiInit }, frugal);
    expect(result.status).toBe('trapped');
    // Closed form: V' = 0.2 V0 (φ − 3) vanishes at φ = 3, where V = V0 > 0.
    expect(minimumIn(result.message)).toBeCloseTo(3, 5);
    expect(result.message).toMatch(/inflation never ends/);
  });

  it('"V0 * (1 + 10 * (phi - 3)^2)" from φ = 10 ends inflation briefly, then settles at φ = 3: trapped, not "start further up"', () => {
    const result = evaluate({ potential: 'V0 * (1 + 10 * (phi - 3)^2)', params: { V0: 1e-10 }, phiInit: 10 }, frugal);
    expect(result.status).toBe('trapped');
    expect(result.message).toMatch(/inflation stops briefly/);
    // Closed form: the minimum is where V' = 20 V0 (φ − 3) = 0.
    expect(minimumIn(result.message)).toBeCloseTo(3, 5);
    expect(result.message).not.toMatch(/start further up/);
  });

  it('a tilted cosine "V0 * (1 - cos(phi / f)) + t * phi" from φ = 18.5 is trapped in its nearest minimum', () => {
    const params = { V0: 1e-10, f: 3, t: 1e-12 };
    const result = evaluate({ potential: 'V0 * (1 - cos(phi / f)) + t * phi', params, phiInit: 18.5 }, frugal);
    expect(result.status).toBe('trapped');
    const phiMin = minimumIn(result.message);
    // Closed form: V' = (V0/f) sin(φ/f) + t = 0 with V'' = (V0/f²) cos(φ/f) > 0, the minimum below 6πf = 18.85.
    expect(Math.abs((params.V0 / params.f) * Math.sin(phiMin / params.f) + params.t)).toBeLessThan(1e-15);
    expect(Math.cos(phiMin / params.f)).toBeGreaterThan(0);
    expect(phiMin).toBeGreaterThan(18.5);
    expect(phiMin).toBeLessThan(6 * Math.PI * params.f);
  });

  it('an exact inflection point is not a minimum: the field stalls there and it stays no_end', () => {
    // V' = 3a V0 (φ − 3)² never changes sign, so no interval confines the field.
    const result = evaluate({ potential: 'V0 * (1 + a * (phi - 3)^3)', params: { V0: 1e-10, a: 0.02 }, phiInit: 6, nStar: 5, method: 'slowroll' });
    expect(result.status).toBe('no_end');
  });

  it('a field that rolls into a minimum with V = 0 still ends inflation normally', () => {
    expect(evaluate({ potential: 'double-well', params: { v: 20 } }, frugal).status).toBe('ok');
    expect(evaluate({ potential: 'monomial', params: { p: 2 } }, frugal).status).toBe('ok');
  });
});

describe('per-point budgets', () => {
  const quadratic = compile('0.5 * phi^2', {});

  it('the stored table never exceeds the steps budget, and running past it says so', () => {
    const solver = new BackgroundSolver();
    const budget = new BudgetMeter({ budget: { steps: 40 } });
    budget.start();
    const result = solver.solve(quadratic, 16, DEFAULT_BACKGROUND_OPTIONS, budget);
    expect(result.status).toBe('budget_exceeded');
    expect(solver.table.length).toBeLessThanOrEqual(40);
    if (result.status === 'budget_exceeded') expect(result.message).toMatch(/budget of 40 stored steps ran out in the background integration, after [\d.]+ e-folds: the field was at φ = [\d.]+ moving at dφ\/dN = -/);
    // The same point with the default budget stores more than 40 steps and ends normally.
    const unbounded = solver.solve(quadratic, 16);
    expect(unbounded.status).toBe('ok');
    expect(solver.table.length).toBeGreaterThan(40);
  });

  it('a model that never ends inflation is stopped by the steps budget before its e-fold cap', () => {
    const solver = new BackgroundSolver();
    const budget = new BudgetMeter({ budget: { steps: 100 } });
    budget.start();
    const stalled = compile('1 + 0.02 * (phi - 3)^3', {});
    const result = solver.solve(stalled, 6, DEFAULT_BACKGROUND_OPTIONS, budget);
    expect(result.status).toBe('budget_exceeded');
    expect(solver.table.length).toBeLessThanOrEqual(100);
  });

  it('the evaluations budget ends a point in the background or in the mode equations', () => {
    const spec = { potential: quadratic, phiInit: 16, method: 'exact' as const, nStar: 55 };
    const full = new PointEvaluator().evaluate(spec);
    const background = new PointEvaluator().evaluate({ ...spec, method: 'slowroll' });
    if (full.status !== 'ok' || background.status !== 'ok') throw new Error('the quadratic point should succeed');
    expect(full.evaluations).toBeGreaterThan(background.evaluations);

    const inBackground = new PointEvaluator({}, { budget: { evaluations: 100 } }).evaluate(spec);
    expect(inBackground.status).toBe('budget_exceeded');
    expect(inBackground.message).toMatch(/right-hand-side evaluations ran out in the background integration/);

    const inModes = new PointEvaluator({}, { budget: { evaluations: background.evaluations + 1000 } }).evaluate(spec);
    expect(inModes.status).toBe('budget_exceeded');
    expect(inModes.message).toMatch(/right-hand-side evaluations ran out in the mode equations/);

    // Exactly what the point needs is enough.
    expect(new PointEvaluator({}, { budget: { evaluations: full.evaluations } }).evaluate(spec).status).toBe('ok');
  });

  it('the wall-time budget counts only with a clock passed in', () => {
    let ticks = 0;
    const clock = () => ticks++; // one millisecond per reading
    const spec = { potential: quadratic, phiInit: 16, method: 'exact' as const, nStar: 55 };
    const timed = new PointEvaluator({}, { budget: { wallTimeMs: 50 }, now: clock }).evaluate(spec);
    expect(timed.status).toBe('budget_exceeded');
    expect(timed.message).toMatch(/0\.05 s of computing time/);
    expect(new PointEvaluator({}, { budget: { wallTimeMs: 50 } }).evaluate(spec).status).toBe('ok');
  });

  it('a budget failure comes back through the request evaluator with its status', () => {
    const tight = new RequestEvaluator({ budget: { steps: 10 } });
    const result = tight.evaluate({ potential: 'monomial', nStar: 55, method: 'slowroll' });
    expect(result.status).toBe('budget_exceeded');
    expect(result.ns).toBeNull();
    expect(result.message).toMatch(/10 stored steps/);
  });
});
