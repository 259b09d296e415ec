import createIntegrator from 'ode45-cash-karp';

/** Right-hand side dy/dt written into `out`; must not allocate. */
export type Derivative = (out: Float64Array, y: Float64Array, t: number) => void;

export interface StepperOptions {
  /** Error tolerance per step (the library's mixed relative/absolute measure). */
  tolerance: number;
  /** Largest step allowed, in units of t. */
  maxStep: number;
}

export type StepResult = 'ok' | 'non_finite' | 'underflow';

/**
 * The one wrapper around `ode45-cash-karp` (Cash & Karp 1990, ACM TOMS 16, 201: embedded
 * 5(4) Runge-Kutta). It owns its state buffer, so callers' arrays are never mutated; it turns
 * the library's console output off and its NaN exception into a status; and it keeps the
 * state and derivative at the start of the last accepted step for interpolation and
 * root-finding inside that step. Nothing is allocated after construction.
 */
export class CashKarpStepper {
  readonly dim: number;
  /** State at the current time (read-only for callers). */
  readonly y: Float64Array;
  /** State and derivative at the start of the last accepted step. */
  readonly yPrev: Float64Array;
  readonly dyPrev: Float64Array;
  /** Derivative at the current state, valid only after `computeDerivative()`. */
  readonly dy: Float64Array;
  tPrev = 0;
  /** Right-hand-side evaluations since the last `reset()`. */
  evaluations = 0;

  private readonly integrator: ReturnType<typeof createIntegrator>;
  private readonly minStep: number;

  constructor(dim: number, private readonly deriv: Derivative, options: StepperOptions) {
    this.dim = dim;
    this.y = new Float64Array(dim);
    this.yPrev = new Float64Array(dim);
    this.dyPrev = new Float64Array(dim);
    this.dy = new Float64Array(dim);
    const counted: Derivative = (out, y, t) => {
      this.evaluations++;
      deriv(out, y, t);
    };
    this.integrator = createIntegrator(this.y, counted, 0, options.maxStep, {
      tol: options.tolerance,
      dtMaxMag: options.maxStep,
      verbose: false,
    });
    this.minStep = 1e-13;
  }

  get t(): number {
    return this.integrator.t;
  }

  setTolerance(tolerance: number, maxStep: number): void {
    this.integrator.tol = tolerance;
    this.integrator.dtMaxMag = maxStep;
  }

  /** Starts a new integration at (t0, y0) with a first step of dt0; copies y0. */
  reset(t0: number, y0: ArrayLike<number>, dt0: number): void {
    for (let i = 0; i < this.dim; i++) this.y[i] = y0[i];
    this.integrator.y = this.y;
    this.integrator.t = t0;
    this.integrator.dt = dt0;
    this.tPrev = t0;
    this.evaluations = 0;
  }

  /** Evaluates the derivative at the current state into `dy` (one extra evaluation). */
  computeDerivative(): void {
    this.deriv(this.dy, this.y, this.integrator.t);
    this.evaluations++;
  }

  /** One adaptive step, never past `tLimit`. */
  step(tLimit: number): StepResult {
    const integ = this.integrator;
    this.tPrev = integ.t;
    this.yPrev.set(this.y);
    try {
      integ.step(tLimit);
    } catch {
      return 'non_finite';
    }
    // The library's first stage is the derivative at the start of the step: reuse it.
    this.dyPrev.set(integ._k1);
    for (let i = 0; i < this.dim; i++) if (!Number.isFinite(this.y[i])) return 'non_finite';
    if (Math.abs(integ.dt) < this.minStep && Math.abs(tLimit - integ.t) > this.minStep) return 'underflow';
    return 'ok';
  }

  /**
   * Integrates from the start of the last accepted step to `tTarget` (inside that step),
   * leaving the result in `y`; used to land exactly on an event found by interpolation.
   */
  restepTo(tTarget: number): StepResult {
    const integ = this.integrator;
    const h = tTarget - this.tPrev;
    this.y.set(this.yPrev);
    integ.y = this.y;
    integ.t = this.tPrev;
    integ.dt = h;
    if (h === 0) return 'ok';
    for (let guard = 0; guard < 1000 && Math.abs(tTarget - integ.t) > 1e-15 * Math.max(1, Math.abs(tTarget)); guard++) {
      try {
        integ.step(tTarget);
      } catch {
        return 'non_finite';
      }
    }
    return 'ok';
  }
}

/**
 * Cubic Hermite interpolation of component `i` inside the last accepted step (values and
 * derivatives at both ends; call `computeDerivative()` first), O(h^4) accurate: used to
 * bracket events, never as the answer.
 */
export function hermite(s: CashKarpStepper, i: number, t: number): number {
  const h = s.t - s.tPrev;
  if (h === 0) return s.y[i];
  const u = (t - s.tPrev) / h;
  const u2 = u * u;
  const u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * s.yPrev[i] + (u3 - 2 * u2 + u) * h * s.dyPrev[i] + (-2 * u3 + 3 * u2) * s.y[i] + (u3 - u2) * h * s.dy[i];
}
