import { failure, fmt, type Failure } from './types.js';

/** What one point may spend; beyond any of them it ends as `budget_exceeded`. */
export interface PointBudget {
  /** Right-hand-side evaluations of all its integrations (background and modes). */
  evaluations: number;
  /** Stored background steps: the table's length, and so the point's memory (5 doubles a step). */
  steps: number;
  /** Wall time in milliseconds, counted only when a clock is given (`EngineOptions.now`). */
  wallTimeMs: number;
}

/**
 * Far above what any built-in family at its default ranges spends (measured by
 * `shared/bench/budget-use.bench.mjs`; the figures are in DEVELOPERS.md beside these).
 */
export const DEFAULT_POINT_BUDGET: PointBudget = {
  evaluations: 50_000_000,
  steps: 1_000_000, // 40 MB of nodes; the table's capacity doubles, so at most 80 MB
  wallTimeMs: 60_000,
};

export interface EngineOptions {
  budget?: Partial<PointBudget>;
  /** A clock in milliseconds (e.g. `performance.now`); without one there is no wall-time budget, as the engine stays pure. */
  now?: () => number;
}

export type BudgetName = keyof PointBudget;

/** The budget a point runs with: the defaults, with what the caller (the worker's config) sets on top. */
export function pointBudgetOf(options: EngineOptions): PointBudget {
  return { ...DEFAULT_POINT_BUDGET, ...options.budget };
}

/** The spending of one point against its budget. One instance per evaluator, restarted per point. */
export class BudgetMeter {
  readonly limits: PointBudget;
  private readonly now?: () => number;
  private startedAt = 0;
  /** Evaluations of integrations already finished for this point. */
  spent = 0;

  constructor(options: EngineOptions = {}) {
    this.limits = pointBudgetOf(options);
    this.now = options.now;
  }

  start(): void {
    this.spent = 0;
    if (this.now) this.startedAt = this.now();
  }

  /** The first budget the point has run past, given the evaluations and stored steps of the integration under way. */
  exceeded(evaluations: number, steps: number): BudgetName | null {
    if (this.spent + evaluations > this.limits.evaluations) return 'evaluations';
    if (steps > this.limits.steps) return 'steps';
    if (this.now && this.now() - this.startedAt > this.limits.wallTimeMs) return 'wallTimeMs';
    return null;
  }

  /** The failure for a budget run past, saying what the field was doing at that moment. */
  failure(name: BudgetName, where: string, state: { n: number; phi: number; pi: number }): Failure {
    const what = {
      evaluations: `${fmt(this.limits.evaluations)} right-hand-side evaluations`,
      steps: `${fmt(this.limits.steps)} stored steps`,
      wallTimeMs: `${fmt(this.limits.wallTimeMs / 1000)} s of computing time`,
    }[name];
    return failure(
      'budget_exceeded',
      `the point's budget of ${what} ran out ${where}, after ${fmt(state.n)} e-folds: the field was at φ = ${fmt(state.phi)} moving at dφ/dN = ${fmt(state.pi)} (ε_H = ${fmt(0.5 * state.pi * state.pi)})`,
      { nTotal: state.n, phi: state.phi },
    );
  }
}
