import { describe, expect, it } from 'vitest';
import { DEFAULT_BACKGROUND_OPTIONS } from './background/background.js';
import { DEFAULT_POINT_BUDGET } from './budget.js';
import { DEFAULT_MODE_OPTIONS } from './observables/mode-equations.js';
import { resolvedEngineOptions } from './resolved-options.js';

describe('resolvedEngineOptions', () => {
  it('takes the spec tolerance for the background and the defaults for the rest', () => {
    const options = resolvedEngineOptions({ method: 'slowroll', tolerance: 1e-9 });
    expect(options.background).toEqual({ ...DEFAULT_BACKGROUND_OPTIONS, integrator: 'cash-karp-rk45', tolerance: 1e-9 });
    expect(options.modes).toBeNull();
    expect(options.budget).toEqual({ evaluations: DEFAULT_POINT_BUDGET.evaluations, steps: DEFAULT_POINT_BUDGET.steps, wallTimeMs: null });
  });

  it('adds the mode-equation settings for the exact method', () => {
    const options = resolvedEngineOptions({ method: 'exact' });
    expect(options.background.tolerance).toBe(DEFAULT_BACKGROUND_OPTIONS.tolerance);
    expect(options.modes).toEqual({ ...DEFAULT_MODE_OPTIONS, integrator: 'cash-karp-rk45', maxStep: 0.25 });
  });

  it("records a caller's budget and its wall-time limit only with a clock", () => {
    const options = resolvedEngineOptions({ method: 'slowroll' }, { budget: { wallTimeMs: 5000, steps: 10 }, now: () => 0 });
    expect(options.budget).toEqual({ evaluations: DEFAULT_POINT_BUDGET.evaluations, steps: 10, wallTimeMs: 5000 });
  });
});
