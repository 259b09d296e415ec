import { backgroundOptionsFor, type BackgroundOptions } from './background/background.js';
import { pointBudgetOf, type EngineOptions, type PointBudget } from './budget.js';
import type { Method } from './evaluate-point.js';
import { DEFAULT_MODE_OPTIONS, MODE_MAX_STEP, type ModeOptions } from './observables/mode-equations.js';

/**
 * The integrator settings one point of a spec runs with, as the engine resolves them: the same
 * functions `PointEvaluator` and `BudgetMeter` call, so what is recorded is what ran.
 */
export interface ResolvedEngineOptions {
  method: Method;
  /** Cash–Karp RK45 over N of the background: tolerance, largest step (e-folds), look-ahead and field limit. */
  background: BackgroundOptions & { integrator: 'cash-karp-rk45' };
  /** The mode equations (exact method only): start and end depths, safeties, tolerance, stencil and largest step. */
  modes: (ModeOptions & { integrator: 'cash-karp-rk45'; maxStep: number }) | null;
  /** Per-point budget; `wallTimeMs` is null when no clock is given (the worker's own limit is recorded with each chunk). */
  budget: Omit<PointBudget, 'wallTimeMs'> & { wallTimeMs: number | null };
}

/** The resolved settings for a scan or request with this method and (optional) tolerance. */
export function resolvedEngineOptions(spec: { method: Method; tolerance?: number }, engine: EngineOptions = {}): ResolvedEngineOptions {
  const budget = pointBudgetOf(engine);
  return {
    method: spec.method,
    background: { integrator: 'cash-karp-rk45', ...backgroundOptionsFor(spec.tolerance) },
    // RequestEvaluator never passes mode settings of its own, so an exact point runs with the defaults.
    modes: spec.method === 'exact' ? { integrator: 'cash-karp-rk45', ...DEFAULT_MODE_OPTIONS, maxStep: MODE_MAX_STEP } : null,
    budget: { evaluations: budget.evaluations, steps: budget.steps, wallTimeMs: engine.now ? budget.wallTimeMs : null },
  };
}
