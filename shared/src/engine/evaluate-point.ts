import { BudgetMeter, type EngineOptions } from './budget.js';
import { BackgroundSolver, backgroundOptionsFor, type BackgroundOptions, type BackgroundSolution } from './background/background.js';
import { PIVOT_K_PER_MPC, REDUCED_PLANCK_MASS_GEV, TARGET_AS } from './constants.js';
import { DEFAULT_MODE_OPTIONS, ModeSolver, type ModeOptions } from './observables/mode-equations.js';
import { FEATURE_RESIDUAL } from './observables/spectrum-shape.js';
import { hubbleFlow, potentialSlowRoll, secondOrderSlowRoll, slowRollEfolds, slowRollOutsideRegime, type SecondOrderObservables } from './observables/slow-roll.js';
import { nStarFromReheating, reheatingDensity, type Reheating } from './pivot/reheating.js';
import { failure, fmt, type Failure, type PotentialFunctions } from './types.js';

export type Method = 'slowroll' | 'exact';

export interface PointSpec {
  potential: PotentialFunctions;
  /** Where the background starts, on the slow-roll attractor π = −V'/V. */
  phiInit: number;
  method: Method;
  /** E-folds between the pivot crossing and the end of inflation; or give `reheating`. */
  nStar?: number;
  reheating?: Reheating;
  /** Step tolerance of the background integration (default 1e-6). */
  tolerance?: number;
  /** Settings of the mode integrations (exact method). */
  modes?: Partial<ModeOptions>;
  /** Return φ(N), π(N), ε_H(N) for plots. */
  trajectory?: boolean;
  /** Return P_R(k) and P_t(k) near the pivot (exact method). */
  spectrum?: boolean;
}

export interface PointResult {
  status: 'ok';
  message: string;
  method: Method;
  ns: number;
  r: number;
  alphaS: number;
  nt: number;
  /** A_s of the potential exactly as given. */
  As: number;
  /** Factor by which V must be multiplied for A_s = 2.1e-9. */
  amplitudeScale: number;
  nTotal: number;
  nStar: number;
  phiStar: number;
  phiEnd: number;
  deltaPhi: number;
  /** V_*^{1/4} of the normalised potential, GeV. */
  energyScaleGeV: number;
  /** H at the pivot crossing for the normalised potential, GeV. */
  hubbleGeV: number;
  epsilonV: number;
  etaV: number;
  xi2V: number;
  /** Second-order slow roll on the numerical background (both methods). */
  secondOrder: SecondOrderObservables;
  /** Right-hand-side evaluations of all integrations of this point. */
  evaluations: number;
  trajectory?: { N: number[]; phi: number[]; pi: number[]; epsilonH: number[] };
  spectrum?: { lnK: number[]; kPerMpc: number[]; scalar: number[]; tensor: number[] };
}

export type PointOutcome = PointResult | Failure;

const SPECTRUM_LNK = Array.from({ length: 13 }, (_, i) => -3 + i * 0.5);

/**
 * Evaluates one point: background to the end of inflation, the pivot N_* e-folds before it
 * (fixed or from reheating), and the observables by slow roll or the exact mode equations.
 * Holds its integrators and buffers, so one instance serves any number of points; it is pure
 * (same input, same output) and never throws for a bad model: problems are outcomes.
 */
export class PointEvaluator {
  private readonly background = new BackgroundSolver();
  /** A second path through the same potential, for the attractor check; it stores nothing. */
  private readonly probe = new BackgroundSolver();
  private readonly modes: ModeSolver;
  private readonly pivot = new Float64Array(2);
  private readonly budget: BudgetMeter;
  private lastBackground: { potential: PotentialFunctions; phiInit: number; tolerance: number; solution: BackgroundSolution | Failure } | null = null;

  /** `engine` sets the per-point budgets (defaults `DEFAULT_POINT_BUDGET`) and the clock for the wall-time one. */
  constructor(modeOptions: Partial<ModeOptions> = {}, engine: EngineOptions = {}) {
    this.budget = new BudgetMeter(engine);
    this.modes = new ModeSolver({ ...DEFAULT_MODE_OPTIONS, ...modeOptions });
  }

  evaluate(spec: PointSpec): PointOutcome {
    const invalid = validateSpec(spec);
    if (invalid) return invalid;
    const options = backgroundOptionsFor(spec.tolerance);
    this.budget.start();
    const bg = this.backgroundFor(spec.potential, spec.phiInit, options);
    if (bg.status !== 'ok') return bg;
    this.budget.spent += bg.evaluations;
    const modes = spec.modes ? new ModeSolver({ ...DEFAULT_MODE_OPTIONS, ...spec.modes }) : this.modes;

    let nStar = spec.nStar ?? 55;
    let result = this.observe(spec, bg, nStar, modes);
    if (spec.reheating) {
      // N_* depends on V_* and V_end of the normalised potential, which depend on N_*: iterate.
      for (let iter = 0; iter < 30 && result.status === 'ok'; iter++) {
        const next = this.nStarFor(spec.reheating, spec.potential, result, bg);
        if (typeof next !== 'number') return next;
        if (Math.abs(next - nStar) < 1e-7) break;
        nStar = next;
        result = this.observe(spec, bg, nStar, modes);
      }
    }
    return result;
  }

  /**
   * The background from φ_init, shared with the previous point when it had the same potential
   * (the same bound object), start and tolerance: N_* and the reheating history only move the
   * pivot along it. The solution lives in the solver's table until the next solve, and every
   * solve goes through here, so the remembered one is always the table's. Its evaluations count
   * for every point that uses it, so the numbers and budgets are those of a point computed alone.
   */
  private backgroundFor(potential: PotentialFunctions, phiInit: number, options: BackgroundOptions): BackgroundSolution | Failure {
    const last = this.lastBackground;
    if (last && last.potential === potential && last.phiInit === phiInit && last.tolerance === options.tolerance) return last.solution;
    let bg = this.background.solve(potential, phiInit, options, this.budget);
    // Inflation that pauses (ε_H = 1 on a steep stretch) and resumes ends at its last end.
    for (let pauses = 1; bg.status === 'ok' && pauses <= MAX_PAUSES && this.background.resumesAfterEnd(bg, this.budget); pauses++) {
      this.budget.spent += bg.evaluations;
      bg = this.background.solve(potential, phiInit, options, this.budget, pauses);
    }
    // A budget failure depends on what the point had spent; it is not shared.
    this.lastBackground = bg.status === 'budget_exceeded' ? null : { potential, phiInit, tolerance: options.tolerance, solution: bg };
    return bg;
  }

  private nStarFor(reh: Reheating, potential: PotentialFunctions, point: PointResult, bg: BackgroundSolution): number | Failure {
    const lambda = point.amplitudeScale;
    const hubbleStar = point.hubbleGeV / REDUCED_PLANCK_MASS_GEV;
    const rhoEnd = 1.5 * lambda * potential.V(bg.phiEnd);
    const { rho } = reheatingDensity(reh);
    if (rho > rhoEnd * REDUCED_PLANCK_MASS_GEV ** 4 * (1 + 1e-12)) {
      const end14 = (rhoEnd ** 0.25) * REDUCED_PLANCK_MASS_GEV;
      return failure('invalid_input', `the reheating energy ρ_reh^1/4 = ${fmt(rho ** 0.25)} GeV is above the energy at the end of inflation, ${fmt(end14)} GeV`);
    }
    return nStarFromReheating(reh, hubbleStar, rhoEnd);
  }

  /**
   * Too few e-folds from the start. When slow roll from φ_init would give enough, the field lost
   * them by moving faster than slow roll (it arrived with too much speed: an overshoot), and
   * starting further up only adds speed.
   */
  private tooFewEfolds(spec: PointSpec, bg: BackgroundSolution, nStar: number): Failure {
    const expected = slowRollEfolds(spec.potential, spec.phiInit, bg.phiEnd);
    if (expected >= nStar) {
      return failure(
        'insufficient_efolds',
        `only ${fmt(bg.nEnd)} e-folds of inflation from φ_init = ${fmt(spec.phiInit)} to the end, fewer than N_* = ${fmt(nStar)}, where slow roll would give ${fmt(expected)}: the field arrives too fast and rushes through the flat stretch. Start lower, nearer the region where it slow-rolls (or, for a built-in family, leave φ_init out and let the engine choose)`,
        { nTotal: bg.nEnd },
      );
    }
    return failure('insufficient_efolds', `only ${fmt(bg.nEnd)} e-folds of inflation from φ_init = ${fmt(spec.phiInit)} to the end, fewer than N_* = ${fmt(nStar)}; start further up the potential`, { nTotal: bg.nEnd });
  }

  /**
   * Is the field on its attractor at the pivot? Every start sits at the slow-roll velocity
   * π = −V'/V, which is near but not on the attractor; the difference decays like e^{−3ΔN} in
   * slow roll and not at all in ultra-slow roll. So a second path starts with its velocity 10 %
   * higher and we compare dφ/dN where both pass φ_*: the pivot has forgotten the start when
   * that difference is below 1e-3 of the one at the start (S < 1e-3). Checked for pivots within
   * 12 e-folds of the start (past that, slow roll has damped it by e^{−36}), and for any pivot
   * where the field moves at more than 1.5 times its slow-roll speed −V'/V (ultra-slow roll
   * after an overshoot, which does not forget its start).
   */
  private forgetsStart(spec: PointSpec, nPivot: number, phiStar: number, piStar: number): Failure | null {
    const { potential, phiInit } = spec;
    const slowRollSpeed = Math.abs(potential.dV(phiStar) / potential.V(phiStar));
    if (nPivot >= ATTRACTOR_CHECK_EFOLDS && Math.abs(piStar) <= 1.5 * slowRollSpeed) return null;
    const pi0 = -potential.dV(phiInit) / potential.V(phiInit);
    const kicked = this.probe.velocityAtField(potential, phiInit, pi0 * (1 + START_KICK), phiStar, this.budget);
    if (typeof kicked !== 'number') return kicked;
    const memory = Math.abs(kicked - piStar) / Math.abs(piStar) / START_KICK;
    if (memory < ATTRACTOR_MEMORY) return null;
    // Slow roll damps the memory by e^{−3} per e-fold; past the remaining factor the pivot would have forgotten.
    const needed = Number.isFinite(memory) ? nPivot + Math.log(memory / ATTRACTOR_MEMORY) / 3 : NaN;
    const need = Number.isFinite(needed) ? `about ${fmt(Math.ceil(needed))} e-folds of history before the pivot are needed` : 'more history before the pivot is needed';
    return failure(
      'pivot_too_early',
      `the pivot lies only ${fmt(nPivot)} e-folds after the start, and the field there still remembers how it started (a 10 % different starting speed changes dφ/dN at φ_* by ${Number.isFinite(memory) ? `${fmt(memory * START_KICK * 100)} %` : 'more than the field can show'}): it is not yet on its attractor. ${need}, ${fmt(nPivot)} available; start further up the potential`,
      { nTotal: nPivot, phi: phiStar },
    );
  }

  private observe(spec: PointSpec, bg: BackgroundSolution, nStar: number, modes: ModeSolver): PointOutcome {
    if (bg.nEnd < nStar) {
      const settles = this.background.settlesAfterEnd(bg, this.budget);
      if (settles) return settles;
      return this.tooFewEfolds(spec, bg, nStar);
    }
    const nPivot = bg.nEnd - nStar;
    this.background.stateAt(nPivot, this.pivot);
    const phiStar = this.pivot[0];
    const piStar = this.pivot[1];
    const potential = spec.potential;
    const sr = potentialSlowRoll(potential, phiStar);
    const flow = hubbleFlow(potential, phiStar, piStar);
    const second = secondOrderSlowRoll(flow);
    if (spec.method === 'slowroll') {
      const outside = slowRollOutsideRegime(sr, second);
      if (outside) return failure('slow_roll_invalid', `slow roll does not hold at the pivot (φ_* = ${fmt(phiStar)}): ${outside}; use the exact method`, { nTotal: bg.nEnd, phi: phiStar });
    }
    const early = this.forgetsStart(spec, nPivot, phiStar, piStar);
    if (early) return early;
    let { ns, r, alphaS, As } = sr;
    let nt = sr.nt;
    let spectrum: PointResult['spectrum'];
    if (spec.method === 'exact') {
      const exact = modes.solve(potential, bg, nPivot, { phi: phiStar, pi: piStar }, spec.spectrum ? SPECTRUM_LNK : undefined, this.budget);
      if ('status' in exact) return exact;
      if (exact.featureResidual > FEATURE_RESIDUAL) {
        return failure(
          'spectrum_feature',
          `the spectrum is not a power law at the pivot: across ln(k/k_*) = ±${fmt(2 * modes.stencil)} P_R departs from a power law with running by up to ${fmt(exact.featureResidual * 100)} % (a step or oscillation there), so n_s and α_s from the stencil would describe the feature, not a tilt; r = ${fmt(exact.r)} at k_* itself`,
          { nTotal: bg.nEnd, phi: phiStar, observables: { ns: exact.ns, r: exact.r, alphaS: exact.alphaS, As: exact.As } },
        );
      }
      ({ ns, r, alphaS, As } = exact);
      nt = -r / 8;
      if (exact.spectrum) {
        spectrum = { ...exact.spectrum, kPerMpc: exact.spectrum.lnK.map((l) => PIVOT_K_PER_MPC * Math.exp(l)) };
      }
    }
    if (!(As > 0) || !Number.isFinite(ns)) {
      return failure('integration_failed', `the observables at the pivot are not finite (A_s = ${fmt(As)}, n_s = ${fmt(ns)})`, { nTotal: bg.nEnd });
    }
    const amplitudeScale = TARGET_AS / As;
    const vStar = potential.V(phiStar) * amplitudeScale;
    const hubble = Math.sqrt(flow.hubble2 * amplitudeScale);
    const result: PointResult = {
      status: 'ok',
      message: '',
      method: spec.method,
      ns,
      r,
      alphaS,
      nt,
      As,
      amplitudeScale,
      nTotal: bg.nEnd,
      nStar,
      phiStar,
      phiEnd: bg.phiEnd,
      deltaPhi: Math.abs(phiStar - bg.phiEnd),
      energyScaleGeV: vStar ** 0.25 * REDUCED_PLANCK_MASS_GEV,
      hubbleGeV: hubble * REDUCED_PLANCK_MASS_GEV,
      epsilonV: sr.epsilonV,
      etaV: sr.etaV,
      xi2V: sr.xi2V,
      secondOrder: second,
      // Everything the point spent: background, attractor check, modes, reheating iterations.
      evaluations: this.budget.spent,
    };
    if (spec.trajectory) result.trajectory = trajectoryOf(bg);
    if (spectrum) result.spectrum = spectrum;
    return result;
  }
}


/** Pivots this close to the start are checked for memory of the start (see `forgetsStart`). */
const ATTRACTOR_CHECK_EFOLDS = 12;
/** Pauses of inflation passed over before the end is taken as final. */
const MAX_PAUSES = 8;
const START_KICK = 0.1;
const ATTRACTOR_MEMORY = 1e-3;

function trajectoryOf(bg: BackgroundSolution): NonNullable<PointResult['trajectory']> {
  const t = bg.table;
  const N = Array.from(t.n.subarray(0, t.length));
  const phi = Array.from(t.phi.subarray(0, t.length));
  const pi = Array.from(t.pi.subarray(0, t.length));
  return { N, phi, pi, epsilonH: pi.map((p) => 0.5 * p * p) };
}

function validateSpec(spec: PointSpec): Failure | null {
  if (!Number.isFinite(spec.phiInit)) return failure('invalid_input', `φ_init must be a finite number, not ${spec.phiInit}`);
  if (spec.method !== 'slowroll' && spec.method !== 'exact') return failure('invalid_input', `method must be 'slowroll' or 'exact', not '${String(spec.method)}'`);
  if (spec.reheating && spec.nStar !== undefined) return failure('invalid_input', 'give either N_* or a reheating history, not both');
  if (!spec.reheating) {
    const n = spec.nStar;
    if (n === undefined || !Number.isFinite(n) || n <= 0 || n > 1000) return failure('invalid_input', `N_* must be a number between 0 and 1000, not ${n}`);
  } else {
    const { w, energyGeV, temperatureGeV, dof } = spec.reheating;
    if (!Number.isFinite(w) || w <= -1 / 3 || w > 1) return failure('invalid_input', `w_reh must lie in (−1/3, 1], not ${w}`);
    const scale = energyGeV ?? temperatureGeV;
    if ((energyGeV === undefined) === (temperatureGeV === undefined)) return failure('invalid_input', 'give the reheating energy scale or the reheating temperature (one of them)');
    if (!Number.isFinite(scale) || (scale as number) <= 0) return failure('invalid_input', `the reheating scale must be a positive number of GeV, not ${scale}`);
    if (dof !== undefined && (!Number.isFinite(dof) || dof <= 0)) return failure('invalid_input', `the reheating degrees of freedom must be positive, not ${dof}`);
  }
  if (spec.tolerance !== undefined && !(spec.tolerance >= 1e-14 && spec.tolerance <= 1e-4)) {
    return failure('invalid_input', `tolerance must lie between 1e-14 and 1e-4, not ${spec.tolerance}`);
  }
  return null;
}
