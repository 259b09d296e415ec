import { CashKarpStepper, hermite } from '../integrators/cash-karp.js';
import { BudgetMeter } from '../budget.js';
import { failure, fmt, type Failure, type PotentialFunctions } from '../types.js';

export interface BackgroundOptions {
  /** Step error tolerance of the integrator. */
  tolerance: number;
  /** Largest step in e-folds (keeps the stored nodes dense enough to interpolate). */
  maxStep: number;
  /**
   * After this many e-folds (and again at every doubling) the potential ahead of the field is read
   * to decide whether inflation can still end (`fateAhead`); there is no cap on the e-folds.
   */
  lookAheadAfter: number;
  /** |φ| beyond this is a field running off to infinity (`no_end`). */
  fieldLimit: number;
}

export const DEFAULT_BACKGROUND_OPTIONS: BackgroundOptions = {
  tolerance: 1e-6,
  maxStep: 2,
  lookAheadAfter: 1000,
  fieldLimit: 1e8,
};

/** The background options a point runs with: the defaults, with the spec's tolerance when it gives one. */
export function backgroundOptionsFor(tolerance: number | undefined): BackgroundOptions {
  return { ...DEFAULT_BACKGROUND_OPTIONS, tolerance: tolerance ?? DEFAULT_BACKGROUND_OPTIONS.tolerance };
}

/**
 * The accepted integration nodes: N, φ, π = dφ/dN and their N-derivatives, so that any
 * N inside can be interpolated (cubic Hermite) and any step re-taken exactly.
 */
export class BackgroundTable {
  length = 0;
  n = new Float64Array(512);
  phi = new Float64Array(512);
  pi = new Float64Array(512);
  dphi = new Float64Array(512);
  dpi = new Float64Array(512);

  clear(): void {
    this.length = 0;
  }

  push(n: number, y: Float64Array, dy: Float64Array): void {
    if (this.length === this.n.length) this.grow();
    const i = this.length++;
    this.n[i] = n;
    this.phi[i] = y[0];
    this.pi[i] = y[1];
    this.dphi[i] = dy[0];
    this.dpi[i] = dy[1];
  }

  /** Index i with n[i] <= N < n[i+1] (clamped), by bisection. */
  locate(N: number): number {
    let lo = 0;
    let hi = this.length - 1;
    if (N <= this.n[0]) return 0;
    if (N >= this.n[hi]) return hi - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (this.n[mid] <= N) lo = mid;
      else hi = mid;
    }
    return lo;
  }

  /** Interpolates (φ, π) at N into out[0], out[1]. */
  interpolate(N: number, out: Float64Array): void {
    const i = this.locate(N);
    const h = this.n[i + 1] - this.n[i];
    const u = (N - this.n[i]) / h;
    const u2 = u * u;
    const u3 = u2 * u;
    const a = 2 * u3 - 3 * u2 + 1;
    const b = (u3 - 2 * u2 + u) * h;
    const c = -2 * u3 + 3 * u2;
    const d = (u3 - u2) * h;
    out[0] = a * this.phi[i] + b * this.dphi[i] + c * this.phi[i + 1] + d * this.dphi[i + 1];
    out[1] = a * this.pi[i] + b * this.dpi[i] + c * this.pi[i + 1] + d * this.dpi[i + 1];
  }

  private grow(): void {
    // Doubling, so the memory is at most twice the stored steps (which the steps budget bounds).
    const size = this.n.length * 2;
    for (const key of ['n', 'phi', 'pi', 'dphi', 'dpi'] as const) {
      const next = new Float64Array(size);
      next.set(this[key]);
      this[key] = next;
    }
  }
}

export interface BackgroundSolution {
  status: 'ok';
  /** E-folds from φ_init to the end of inflation (ε_H = 1). */
  nEnd: number;
  phiEnd: number;
  piEnd: number;
  table: BackgroundTable;
  evaluations: number;
}

/**
 * Background of a single-field model in e-folds N with state (φ, π = dφ/dN), M_pl = 1:
 *   ε_H = π²/2,  H² = V/(3 − ε_H),  dπ/dN = −(3 − ε_H)(π + V'/V),
 * the Klein-Gordon and Friedmann equations with N as time (e.g. Baumann, TASI lectures on
 * inflation, arXiv:0907.5424, with dN = H dt). It starts on the slow-roll attractor π = −V'/V
 * and ends where ε_H = 1, located to ~1e-12 in N inside the last step.
 */
export class BackgroundSolver {
  readonly table = new BackgroundTable();
  private potential!: PotentialFunctions;
  private badV = 0; // why the path failed: 1 V <= 0, 2 V not finite
  private badPhi = 0;
  private readonly stepper: CashKarpStepper;
  private readonly node = new Float64Array(2);

  constructor(private options: BackgroundOptions = DEFAULT_BACKGROUND_OPTIONS) {
    this.stepper = new CashKarpStepper(2, (out, y) => this.rhs(out, y), options);
  }

  private rhs(out: Float64Array, y: Float64Array): void {
    const phi = y[0];
    const pi = y[1];
    const V = this.potential.V(phi);
    const eps = 0.5 * pi * pi;
    out[0] = pi;
    out[1] = -(3 - eps) * (pi + this.potential.dV(phi) / V);
  }

  solve(
    potential: PotentialFunctions,
    phiInit: number,
    options: BackgroundOptions = this.options,
    budget: BudgetMeter = new BudgetMeter(),
    /** Brief ends of inflation to pass over (ε_H = 1 reached, then inflation resumes; see `resumesAfterEnd`). */
    pauses = 0,
  ): BackgroundSolution | Failure {
    this.potential = potential;
    this.options = options;
    this.stepper.setTolerance(options.tolerance, options.maxStep);
    this.table.clear();
    this.badV = 0;

    const V0 = potential.V(phiInit);
    const dV0 = potential.dV(phiInit);
    if (!Number.isFinite(V0) || !Number.isFinite(dV0)) {
      return failure('invalid_potential', `V or V' is not a finite number at φ_init = ${fmt(phiInit)} (V = ${fmt(V0)})`, { phi: phiInit });
    }
    if (V0 <= 0) {
      return failure('negative_potential', `V(φ_init) = ${fmt(V0)} is not positive; inflation needs V > 0`, { phi: phiInit });
    }
    const epsV0 = 0.5 * (dV0 / V0) ** 2;
    if (epsV0 >= 1) {
      return failure('no_inflation_at_start', `ε = ${fmt(epsV0)} ≥ 1 at φ_init = ${fmt(phiInit)}: the field does not inflate there; start further up the potential`, { phi: phiInit, nTotal: 0 });
    }
    const slope = dV0 / V0;
    if (Math.abs(slope) < 1e-14) {
      const curvature = potential.d2V(phiInit);
      if (curvature > 0) {
        return failure('trapped', `φ_init = ${fmt(phiInit)} is a minimum of V with V > 0: the field stays there and inflation never ends`, { phi: phiInit, nTotal: Infinity });
      }
      return failure('no_end', `V' = 0 at φ_init = ${fmt(phiInit)} (a maximum or flat point): the field starts at rest and never rolls; move φ_init off the extremum`, { phi: phiInit });
    }

    const s = this.stepper;
    const y0 = [phiInit, -slope];
    s.reset(0, y0, Math.min(0.01, options.maxStep));
    let turns = 0;
    let lastTurnPhi = NaN;
    let lookAheadAt = options.lookAheadAfter;
    let paused = false;
    for (;;) {
      let result = s.step(Infinity);
      // A step that ends where V ≤ 0 or is undefined, or whose trial stages strayed there, is
      // retaken in shorter pieces; only if that fails does the path itself leave the domain.
      if ((result === 'ok' && !(potential.V(s.y[0]) > 0)) || result === 'non_finite') {
        if (this.retakeInsideDomain()) result = 'ok';
        else if (this.badV !== 0) return this.potentialFailure();
      }
      if (result === 'non_finite') {
        return failure('integration_failed', `the integration produced non-finite values near N = ${fmt(s.tPrev)}, φ = ${fmt(s.yPrev[0])}`, { nTotal: s.tPrev, phi: s.yPrev[0] });
      }
      if (result === 'underflow') {
        return failure('integration_failed', `the step size underflowed near N = ${fmt(s.t)}, φ = ${fmt(s.y[0])}`, { nTotal: s.t, phi: s.y[0] });
      }
      // One node is kept for the end of inflation, so the table never holds more than the steps budget.
      const over = budget.exceeded(s.evaluations, this.table.length + 2);
      if (over) return budget.failure(over, 'in the background integration', { n: s.t, phi: s.y[0], pi: s.y[1] });
      this.table.push(s.tPrev, s.yPrev, s.dyPrev);
      const pi = s.y[1];
      const eps = 0.5 * pi * pi;
      if (paused) {
        if (eps < 1) paused = false;
        continue;
      }
      if (eps >= 1) {
        if (pauses === 0) return this.locateEnd();
        pauses--;
        paused = true;
        continue;
      }
      if (pi * s.yPrev[1] < 0) {
        // The field turned around: a second turn means it oscillates in a minimum while inflating.
        turns++;
        if (turns >= 2) return this.trapped(lastTurnPhi, s.y[0]);
        lastTurnPhi = s.y[0];
      }
      const basin = this.confiningBasin(s.y[0], pi);
      if (basin) return this.trapped(basin[0], basin[1]);
      if (Math.abs(s.y[0]) > options.fieldLimit) {
        return failure('no_end', `the field ran off to φ = ${fmt(s.y[0])} after ${fmt(s.t)} e-folds without inflation ending`, { nTotal: s.t, phi: s.y[0] });
      }
      if (s.t >= lookAheadAt) {
        lookAheadAt *= 2;
        const never = this.fateAhead(s.y[0], pi);
        if (never) return failure('no_end', `inflation has not ended after ${fmt(s.t)} e-folds and never will: ${never}`, { nTotal: s.t, phi: s.y[0] });
      }
    }
  }

  /**
   * Whether inflation can still end, read from the potential ahead of a field that has inflated
   * for a long time. On its attractor the field rolls downhill at dφ/dN ≈ −V'/V, so walking the
   * potential in that direction (steps of 1e-3 relative, up to the field limit) tells its fate:
   *  - ε_V = (V'/V)²/2 reaches 1, V reaches 0, or V' changes sign (a minimum, where the trapped
   *    criteria take over): something happens there, so the integration goes on (null);
   *  - V' vanishes without changing sign (an exact inflection or a flat stretch, found by refining
   *    each local minimum of |V'/V| to below 1e-12): the slow-roll velocity vanishes there and the
   *    field approaches that point for ever;
   *  - none of these up to |φ| = fieldLimit: the field rolls on for ever with ε_V < 1.
   * Returns the reason inflation never ends, or null while it still can. Sampling can miss a
   * feature narrower than the step; the budgets bound the integration then.
   */
  private fateAhead(phi: number, pi: number): string | null {
    const p = this.potential;
    const slope = (x: number) => p.dV(x) / p.V(x);
    const s0 = slope(phi);
    const direction = s0 !== 0 ? -Math.sign(s0) : Math.sign(pi) || 1;
    const limit = this.options.fieldLimit;
    let x = phi;
    let prev = Math.abs(s0);
    let prevPrev = Infinity;
    let maxEps = 0.5 * s0 * s0;
    while (Math.abs(x) < limit) {
      const h = 1e-3 * Math.max(1, Math.abs(x));
      const next = x + direction * h;
      const V = p.V(next);
      const v1 = slope(next);
      if (!(V > 0) || !Number.isFinite(v1)) return null;
      if (V < 1e-280) {
        return `ahead of the field the potential falls towards zero with ε_V ≤ ${fmt(Math.max(maxEps, 0.5 * v1 * v1))} < 1 until it leaves double precision at φ = ${fmt(next)}, so the field rolls on for ever`;
      }
      if (-direction * v1 < 0) return null;
      const eps = 0.5 * v1 * v1;
      if (eps >= 1) return null;
      maxEps = Math.max(maxEps, eps);
      const a = Math.abs(v1);
      if (a === 0) return `V'/V is zero to double precision from φ = ${fmt(next)} on, ahead of the field (V > 0 there); the field slows down approaching that flat stretch and never gets past`;
      if (prev < prevPrev && prev < a) {
        // |V'/V| had a local minimum near x: refine it; zero there is a stationary point the field cannot pass.
        // Strictly: a slope fading through the subnormals repeats values, which is no minimum.
        const at = this.smallestSlope(x - direction * h, next);
        if (Math.abs(slope(at)) < 1e-12) {
          return `V' vanishes at φ = ${fmt(at)} ahead of the field (V > 0 there) without changing sign; the field slows down approaching it and never gets past`;
        }
      }
      prevPrev = prev;
      prev = a;
      x = next;
    }
    return `ahead of the field the potential keeps falling with ε_V ≤ ${fmt(maxEps)} < 1 all the way to |φ| = ${fmt(limit)}, so the field rolls on for ever`;
  }

  /** Where |V'/V| is smallest between two field values, by golden-section search. */
  private smallestSlope(a: number, b: number): number {
    const p = this.potential;
    const f = (x: number) => Math.abs(p.dV(x) / p.V(x));
    const g = (Math.sqrt(5) - 1) / 2;
    let lo = Math.min(a, b);
    let hi = Math.max(a, b);
    for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); i++) {
      const m1 = hi - g * (hi - lo);
      const m2 = lo + g * (hi - lo);
      if (f(m1) < f(m2)) hi = m2;
      else lo = m1;
    }
    return 0.5 * (lo + hi);
  }

  /** Root of ε_H = 1 in the last step: bracket on the interpolant, then Newton on re-taken steps. */
  private locateEnd(): BackgroundSolution | Failure {
    const s = this.stepper;
    s.computeDerivative();
    let lo = s.tPrev;
    let hi = s.t;
    const g = (t: number) => 0.5 * hermite(s, 1, t) ** 2 - 1;
    for (let i = 0; i < 60 && hi - lo > 1e-14; i++) {
      const mid = 0.5 * (lo + hi);
      if (g(mid) >= 0) hi = mid;
      else lo = mid;
    }
    let tEnd = 0.5 * (lo + hi);
    for (let iter = 0; iter < 8; iter++) {
      if (s.restepTo(tEnd) !== 'ok') break;
      const phi = s.y[0];
      const pi = s.y[1];
      const residual = 0.5 * pi * pi - 1;
      const dpi = -(3 - 0.5 * pi * pi) * (pi + this.potential.dV(phi) / this.potential.V(phi));
      const slope = pi * dpi; // dε_H/dN
      if (slope === 0) break;
      const dt = residual / slope;
      tEnd -= dt;
      if (Math.abs(dt) < 1e-13) break;
    }
    if (s.restepTo(tEnd) !== 'ok') {
      return failure('integration_failed', `could not re-step to the end of inflation near N = ${fmt(tEnd)}`, { nTotal: tEnd });
    }
    if (!(this.potential.V(s.y[0]) > 0)) {
      this.badV = Number.isFinite(this.potential.V(s.y[0])) ? 1 : 2;
      this.badPhi = s.y[0];
      return this.potentialFailure();
    }
    s.computeDerivative();
    this.table.push(tEnd, s.y, s.dy);
    return { status: 'ok', nEnd: tEnd, phiEnd: s.y[0], piEnd: s.y[1], table: this.table, evaluations: s.evaluations };
  }

  /**
   * The last step ended where V ≤ 0 (or V is undefined). Trial stages may stray there near the
   * end of inflation without harm, but an accepted state may not: retake the step in ever
   * shorter pieces; if even a tiny one leaves V > 0 behind, the path really reaches that region.
   */
  private retakeInsideDomain(): boolean {
    const s = this.stepper;
    let h = s.t - s.tPrev;
    let lastStatus = 'ok';
    while (h > 1e-12) {
      h /= 4;
      lastStatus = s.restepTo(s.tPrev + h);
      if (lastStatus === 'ok' && this.potential.V(s.y[0]) > 0) return true;
    }
    const phi = lastStatus === 'ok' && Number.isFinite(s.y[0]) ? s.y[0] : s.yPrev[0];
    const V = this.potential.V(phi);
    // Even the shortest step fails: V ≤ 0 there, or V or V' stops being defined just beyond.
    this.badV = lastStatus === 'ok' && V <= 0 ? 1 : 2;
    this.badPhi = phi;
    return false;
  }

  /**
   * The exact state (φ, π) at N inside the last solution: re-integrated from the stored node
   * before N, not interpolated, since n_s moves by ~6e-4 per e-fold of error in the pivot.
   */
  stateAt(N: number, out: Float64Array): void {
    const t = this.table;
    const i = t.locate(N);
    const s = this.stepper;
    this.node[0] = t.phi[i];
    this.node[1] = t.pi[i];
    s.reset(t.n[i], this.node, Math.min(0.05, N - t.n[i] || 0.05));
    for (let guard = 0; s.t < N && guard < 10_000; guard++) {
      if (s.step(N) !== 'ok') break;
    }
    out[0] = s.y[0];
    out[1] = s.y[1];
  }

  /**
   * dφ/dN where the field passes φ_target, starting from (φ_init, π_init) and storing nothing: a
   * second path through the same potential, to see whether the pivot remembers how the field
   * started. It goes on through pauses of inflation (ε_H ≥ 1). NaN when the field never gets
   * there (turns, stalls, leaves V > 0).
   */
  velocityAtField(potential: PotentialFunctions, phiInit: number, piInit: number, phiTarget: number, budget: BudgetMeter): number | Failure {
    this.potential = potential;
    const s = this.stepper;
    this.stepper.setTolerance(this.options.tolerance, this.options.maxStep);
    this.node[0] = phiInit;
    this.node[1] = piInit;
    s.reset(0, this.node, 0.01);
    const side = Math.sign(phiTarget - phiInit);
    // Bounded by the point's step budget, like the background it retraces.
    for (let steps = 1; ; steps++) {
      if (s.step(Infinity) !== 'ok' || !(potential.V(s.y[0]) > 0)) return NaN;
      const over = budget.exceeded(s.evaluations, steps);
      if (over) return budget.failure(over, 'in the attractor check (a second path from the start)', { n: s.t, phi: s.y[0], pi: s.y[1] });
      if (Math.sign(s.y[1]) !== side) return NaN; // turned before getting there
      if (Math.sign(phiTarget - s.y[0]) !== side) {
        // Crossed inside this step: Newton on re-taken steps lands on φ_target itself (dφ/dN = π).
        const tPrev = s.tPrev;
        let t = tPrev + ((phiTarget - s.yPrev[0]) / (s.y[0] - s.yPrev[0])) * (s.t - tPrev);
        for (let iter = 0; iter < 20; iter++) {
          if (s.restepTo(t) !== 'ok') return NaN;
          const dt = (phiTarget - s.y[0]) / s.y[1];
          t += dt;
          if (Math.abs(dt) < 1e-12) break;
        }
        budget.spent += s.evaluations;
        return s.y[1];
      }
    }
  }

  private potentialFailure(): Failure {
    const n = this.table.n[this.table.length - 1];
    if (this.badV === 1) {
      return failure('negative_potential', `V ≤ 0 at φ = ${fmt(this.badPhi)} on the path, after about ${fmt(n)} e-folds; the field reached a region where V is not positive before inflation ended`, { phi: this.badPhi, nTotal: n });
    }
    return failure('invalid_potential', `V is not a finite number at φ = ${fmt(this.badPhi)} on the path, or V' stops being defined just beyond it (after about ${fmt(n)} e-folds)`, { phi: this.badPhi, nTotal: n });
  }

  /**
   * Settling into a minimum without oscillating (over-damped, or from either side): the energy
   * density ρ = 3H² = V/(1 − ε_H/3) never grows (dρ/dt = −3Hφ̇²), so a field with V(a) > ρ and
   * V(b) > ρ on both sides of it stays inside (a, b) for ever. We take (a, b) around the minimum
   * the local quadratic model predicts, φ_0 ≈ φ + δ with δ = −V'/V'' (V'' > 0), at 1.5 times the
   * farthest the field can reach in that model, r = √(δ² + 2ε_H/(3V''/V)); inside, V' must go
   * from negative to positive (a minimum, not an inflection) and V(φ_0) > 2ρ/3, so ε_H = 3(1 − V/ρ)
   * stays below 1 there: inflation never ends. Only tried within 1 % of the field scale of a
   * minimum, where the quadratic model holds; the checks themselves decide, not the model.
   */
  private confiningBasin(phi: number, pi: number): [number, number] | null {
    const p = this.potential;
    const d2V = p.d2V(phi);
    if (!(d2V > 0)) return null;
    const V = p.V(phi);
    const delta = -p.dV(phi) / d2V;
    const eps = 0.5 * pi * pi;
    const reach = Math.sqrt(delta * delta + (2 * eps * V) / (3 * d2V));
    if (!(reach < 1e-2 * Math.max(1, Math.abs(phi)))) return null;
    const rho = V / (1 - eps / 3);
    const a = phi + delta - 1.5 * reach;
    const b = phi + delta + 1.5 * reach;
    if (!(a < phi && phi < b && p.V(a) > rho && p.V(b) > rho && p.dV(a) < 0 && p.dV(b) > 0)) return null;
    if (!(p.V(phi + delta) > (2 / 3) * rho)) return null;
    return [a, b];
  }

  /**
   * After a brief end of inflation (ε_H = 1 reached on the way into a minimum), does the field
   * settle into a minimum with V > 0, where inflation resumes for ever? Follows the field on
   * from the end, storing nothing, for at most `efolds` e-folds; null when it does not settle.
   */
  settlesAfterEnd(solution: BackgroundSolution, budget: BudgetMeter, efolds = 200): Failure | null {
    const s = this.stepper;
    this.node[0] = solution.phiEnd;
    this.node[1] = solution.piEnd;
    s.reset(solution.nEnd, this.node, 0.01);
    let turns = 0;
    let lastTurnPhi = NaN;
    const nMax = solution.nEnd + efolds;
    while (s.t < nMax) {
      if (s.step(nMax) !== 'ok' || !(this.potential.V(s.y[0]) > 0) || Math.abs(s.y[0]) > this.options.fieldLimit) return null;
      if (budget.exceeded(s.evaluations, 0)) return null;
      const pi = s.y[1];
      let basin: [number, number] | null = null;
      if (pi * s.yPrev[1] < 0) {
        turns++;
        if (turns >= 2) basin = [lastTurnPhi, s.y[0]];
        lastTurnPhi = s.y[0];
      }
      basin ??= 0.5 * pi * pi < 1 ? this.confiningBasin(s.y[0], pi) : null;
      if (basin) {
        const phiMin = this.minimumBetween(basin[0], basin[1]);
        return failure(
          'trapped',
          `inflation stops briefly after ${fmt(solution.nEnd)} e-folds (ε_H = 1 at φ = ${fmt(solution.phiEnd)}), but the field then settles into the local minimum at φ = ${fmt(phiMin)} (V > 0 there), where inflation resumes and never ends`,
          { phi: phiMin, nTotal: Infinity },
        );
      }
    }
    return null;
  }

  /**
   * After the end of inflation, does it resume? A field that rolls down a steep stretch onto a
   * plateau can reach ε_H = 1 on the way (a brief pause) and then inflate again. Follows the field
   * from the end, storing nothing, for at most 3 e-folds: true when ε_H falls back below 1 and
   * stays there for a whole e-fold while the field keeps its direction; false as soon as the field
   * turns (it oscillates about a minimum: inflation is over).
   */
  resumesAfterEnd(solution: BackgroundSolution, budget: BudgetMeter): boolean {
    if (!this.slowRollRegionAhead(solution.phiEnd, solution.piEnd)) return false;
    const s = this.stepper;
    this.node[0] = solution.phiEnd;
    this.node[1] = solution.piEnd;
    s.reset(solution.nEnd, this.node, 0.01);
    const nMax = solution.nEnd + 3;
    let inflatingSince = NaN;
    while (s.t < nMax) {
      if (s.step(nMax) !== 'ok' || !(this.potential.V(s.y[0]) > 0) || budget.exceeded(s.evaluations, 0)) break;
      if (s.y[1] * solution.piEnd <= 0) break;
      if (0.5 * s.y[1] * s.y[1] >= 1) inflatingSince = NaN;
      else if (Number.isNaN(inflatingSince)) inflatingSince = s.tPrev;
      else if (s.t - inflatingSince >= 1) {
        budget.spent += s.evaluations;
        return true;
      }
    }
    budget.spent += s.evaluations;
    return false;
  }

  /**
   * Is there, between φ and the next minimum of V in the direction the field moves, somewhere
   * with ε_V < 1? Without one, inflation cannot resume before the minimum (sampled every 1 % of
   * the field scale, so the common case, a field falling into its minimum, costs ~100 looks at V).
   */
  private slowRollRegionAhead(phi: number, pi: number): boolean {
    const p = this.potential;
    const direction = Math.sign(pi) || 1;
    let x = phi;
    for (let i = 0; i < 5000 && Math.abs(x) < this.options.fieldLimit; i++) {
      x += direction * 1e-2 * Math.max(1, Math.abs(x));
      const V = p.V(x);
      const dV = p.dV(x);
      if (!(V > 0) || !Number.isFinite(dV)) return false;
      if (direction * dV > 0) return false; // past the minimum: the field climbs from here
      if (0.5 * (dV / V) ** 2 < 1) return true;
    }
    return false;
  }

  /** The zero of V' between two field values on either side of a minimum, by bisection. */
  private minimumBetween(phiA: number, phiB: number): number {
    let lo = Math.min(phiA, phiB);
    let hi = Math.max(phiA, phiB);
    const dLo = this.potential.dV(lo);
    for (let i = 0; i < 100 && hi - lo > 1e-14 * Math.max(1, Math.abs(hi)); i++) {
      const mid = 0.5 * (lo + hi);
      if (this.potential.dV(mid) * dLo > 0) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  }

  private trapped(phiA: number, phiB: number): Failure {
    // The minimum lies between the two turning points (or inside the confining interval).
    const phiMin = this.minimumBetween(phiA, phiB);
    const n = this.stepper.t;
    return failure(
      'trapped',
      `the field settled into the local minimum at φ = ${fmt(phiMin)} (V > 0 there) while still inflating, after ${fmt(n)} e-folds; inflation never ends there`,
      { phi: phiMin, nTotal: n },
    );
  }
}
