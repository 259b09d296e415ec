import type { BackgroundSolution } from '../background/background.js';
import { BudgetMeter } from '../budget.js';
import { CashKarpStepper } from '../integrators/cash-karp.js';
import { powerLawResidual } from './spectrum-shape.js';
import { failure, fmt, type Failure, type PotentialFunctions } from '../types.js';

export interface ModeOptions {
  /** Modes start at least at k/(aH) = this, deep inside the horizon (Bunch-Davies vacuum); deeper when the background oscillates (see `startDepthFor`). */
  startDepth: number;
  /** A mode starts at k/(aH) ≥ this × the largest frequency in N of V''/V it meets before horizon exit. */
  resonanceSafety: number;
  /** A mode starts at (k/(aH))³ ≥ this × the largest |d(V''/V)/dN| it meets before horizon exit. */
  adiabaticSafety: number;
  /** Modes stop at k/(aH) = this, well outside the horizon where ζ and h are frozen. */
  endDepth: number;
  /** Step error tolerance of the mode integrations. */
  tolerance: number;
  /** Spacing in ln k of the five-point stencil around k_* for n_s and α_s. */
  stencil: number;
}

export const DEFAULT_MODE_OPTIONS: ModeOptions = { startDepth: 30, resonanceSafety: 4, adiabaticSafety: 1e5, endDepth: 1e-3, tolerance: 3e-8, stencil: 0.1 };

/** Largest step in e-folds of the mode integrations (and of the background they re-integrate). */
export const MODE_MAX_STEP = 0.25;

export interface ExactObservables {
  ns: number;
  alphaS: number;
  r: number;
  /** P_R(k_*) for the potential as given (before normalisation). */
  As: number;
  Pt: number;
  /** Largest departure of ln P_R from a power law with running across the stencil (`powerLawResidual`). */
  featureResidual: number;
  evaluations: number;
  /** P_R and P_t at ln(k/k_*) = lnK[i], when a spectrum was asked for. */
  spectrum?: { lnK: number[]; scalar: number[]; tensor: number[] };
}

const TWO_PI2 = 2 * Math.PI * Math.PI;
const adiabaticOut = new Float64Array(4);

/**
 * The state (v, v_N) = (vr + i·vi, vNr + i·vNi) at k/aH = x corrected to first adiabatic order for
 * an extra mass term δZ(aH)²: |v| = 1/√(2W) and v_τ = −iWv − (W_τ/2W)v with W² = k² − (aH)²(2 + δZ),
 * to first order in δZ/x²; δZ = 0 returns the state unchanged. Returns a shared buffer.
 */
function adiabaticState(vr: number, vi: number, vNr: number, vNi: number, dZ: number, x: number): Float64Array {
  const amplitude = 1 + dZ / (4 * x * x);
  const ar = amplitude * vr;
  const ai = amplitude * vi;
  const phase = dZ / (2 * x); // −i(W − W_dS)/(aH)
  const growth = dZ / (2 * x * x); // −(W_τ/2W)/(aH) beyond de Sitter, δZ_N dropped
  adiabaticOut[0] = ar;
  adiabaticOut[1] = ai;
  adiabaticOut[2] = amplitude * vNr - phase * ai + growth * ar;
  adiabaticOut[3] = amplitude * vNi + phase * ar + growth * ai;
  return adiabaticOut;
}

/** (√5 − 1)/2: multiples of it modulo 1 fill [0, 1) evenly and never repeat. */
const GOLDEN_FRACTION = (Math.sqrt(5) - 1) / 2;

/**
 * Exact scalar and tensor power spectra from the mode equations in e-folds,
 *   ζ'' + (3 − ε₁ + ε₂) ζ' + (k/aH)² ζ = 0,   h'' + (3 − ε₁) h' + (k/aH)² h = 0,
 * which are the Mukhanov-Sasaki equations (Mukhanov, Feldman & Brandenberger 1992, Phys. Rep.
 * 215, 203; Sasaki 1986) for ζ = v/z, z = a√(2ε₁), and for h = 2v_T/a, with N as time. Each mode
 * starts in the Bunch-Davies state v = e^{−ikτ}(1 − i/kτ)/√(2k) at the depth `startDepthFor`
 * chooses (k/aH = startDepth, or deeper for an oscillating background) and is integrated,
 * together with the background (φ, π), until k/aH = endDepth. The scale factor is
 * normalised so that aH = k_* at the pivot crossing; k is measured in units of k_*.
 * P_R = k³|ζ|²/(2π²), P_t = 2·k³|h|²/(2π²) (two polarisations).
 */
export class ModeSolver {
  private potential!: PotentialFunctions;
  private nPivot = 0;
  private lnHPivot = 0;
  private k = 1;
  private readonly scalar: CashKarpStepper;
  private readonly both: CashKarpStepper;
  private readonly backgroundOnly: CashKarpStepper;
  private readonly start = new Float64Array(10);
  private readonly bg = new Float64Array(2);

  constructor(private options: ModeOptions = DEFAULT_MODE_OPTIONS) {
    this.scalar = new CashKarpStepper(6, (out, y, t) => this.rhs(out, y, t, false), { tolerance: options.tolerance, maxStep: MODE_MAX_STEP });
    this.both = new CashKarpStepper(10, (out, y, t) => this.rhs(out, y, t, true), { tolerance: options.tolerance, maxStep: MODE_MAX_STEP });
    this.backgroundOnly = new CashKarpStepper(2, (out, y) => this.backgroundRhs(out, y), { tolerance: options.tolerance, maxStep: MODE_MAX_STEP });
  }

  /** Spacing in ln k of the stencil around k_*. */
  get stencil(): number {
    return this.options.stencil;
  }

  /** ln(aH) at N for background state (φ, π), with a_* H_* = k_* = 1. */
  private lnAH(N: number, phi: number, pi: number): number {
    const H2 = this.potential.V(phi) / (3 - 0.5 * pi * pi);
    return N - this.nPivot + 0.5 * Math.log(H2) - this.lnHPivot;
  }

  private backgroundRhs(out: Float64Array, y: Float64Array): void {
    const pi = y[1];
    out[0] = pi;
    out[1] = -(3 - 0.5 * pi * pi) * (pi + this.potential.dV(y[0]) / this.potential.V(y[0]));
  }

  private rhs(out: Float64Array, y: Float64Array, N: number, withTensor: boolean): void {
    const phi = y[0];
    const pi = y[1];
    const V = this.potential.V(phi);
    const v1 = this.potential.dV(phi) / V;
    const e1 = 0.5 * pi * pi;
    const piPrime = -(3 - e1) * (pi + v1);
    const e2 = (2 * piPrime) / pi;
    const H2 = V / (3 - e1);
    const lnX = Math.log(this.k) - (N - this.nPivot + 0.5 * Math.log(H2) - this.lnHPivot);
    const x2 = Math.exp(2 * lnX);
    out[0] = pi;
    out[1] = piPrime;
    const friction = 3 - e1 + e2;
    out[2] = y[4];
    out[3] = y[5];
    out[4] = -friction * y[4] - x2 * y[2];
    out[5] = -friction * y[5] - x2 * y[3];
    if (withTensor) {
      const tensorFriction = 3 - e1;
      out[6] = y[8];
      out[7] = y[9];
      out[8] = -tensorFriction * y[8] - x2 * y[6];
      out[9] = -tensorFriction * y[9] - x2 * y[7];
    }
  }

  /** N at which ln(aH) reaches `target` (to `precision` in N), by bisection on the stored background (aH grows while ε₁ < 1). */
  private crossing(bg: BackgroundSolution, target: number, precision = 1e-13): number {
    let lo = 0;
    let hi = bg.nEnd;
    for (let i = 0; i < 200 && hi - lo > precision; i++) {
      const mid = 0.5 * (lo + hi);
      bg.table.interpolate(mid, this.bg);
      if (this.lnAH(mid, this.bg[0], this.bg[1]) < target) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  }

  /**
   * How deep inside the horizon the modes lnKLow … lnKHigh start (one depth for the five modes of
   * the stencil, so that n_s and α_s compare modes started alike). The background they meet, from
   * the start of the lowest to the horizon exit of the highest, is summarised by the mass term
   * q = V''/V sampled along the stored path: its largest size Q = max|q|, its largest rate
   * R = max|dq/dN| and so its largest frequency in N, ω = R/Q (exact for q = A cos ωN; small for a
   * slowly varying q). The modes start at
   *   k/aH = max(startDepth, c·ω, (C·R)^{1/3}),
   * iterated because a deeper start widens the window. c·ω (c = `resonanceSafety`, 4) puts the
   * start 8 times beyond the resonance at k/aH ≈ ω/2 with an oscillating background; (C·R)^{1/3}
   * (C = `adiabaticSafety`, 1e5) keeps the neglected next adiabatic term of the initial state,
   * about (dq/dN)/(k/aH)³, near 1e-5. Smooth potentials have ω ≲ 1 and R ≪ 1 and keep startDepth.
   */
  private startDepthFor(bg: BackgroundSolution, lnKLow: number, lnKHigh: number): number {
    const { startDepth, resonanceSafety, adiabaticSafety } = this.options;
    const nExit = this.crossing(bg, lnKHigh, 1e-3); // only bounds the sampled window
    let depth = startDepth;
    for (let iter = 0; iter < 10; iter++) {
      const nStart = this.crossing(bg, lnKLow - Math.log(depth), 1e-3);
      const { size, rate } = this.massTermAlong(bg, nStart, nExit);
      const frequency = size > 0 ? rate / size : 0;
      const next = Math.max(resonanceSafety * frequency, Math.cbrt(adiabaticSafety * rate));
      if (!(next > depth * 1.001)) break;
      depth = next;
    }
    return depth;
  }

  /**
   * max|q| and max|dq/dN| of q = V''/V on the stored path between n0 and n1. Maxima need no
   * sample in every period, only samples at many phases: they are spread by a golden-ratio
   * sequence, so no period can alias with their spacing.
   */
  private massTermAlong(bg: BackgroundSolution, n0: number, n1: number): { size: number; rate: number } {
    const p = this.potential;
    const samples = Math.min(512, 8 + Math.ceil(8 * (n1 - n0)));
    let size = 0;
    let rate = 0;
    for (let j = 0; j < samples; j++) {
      bg.table.interpolate(n0 + ((j * GOLDEN_FRACTION) % 1) * (n1 - n0), this.bg);
      const phi = this.bg[0];
      const V = p.V(phi);
      const q = p.d2V(phi) / V;
      const dq = this.bg[1] * (p.d3V(phi) / V - (q * p.dV(phi)) / V);
      if (Number.isFinite(q) && Number.isFinite(dq)) {
        size = Math.max(size, Math.abs(q));
        rate = Math.max(rate, Math.abs(dq));
      }
    }
    return { size, rate };
  }

  /**
   * (z''/z)/(aH)² − 2 for z = a√(2ε₁): (1 + ε₂/2)(2 − ε₁ + ε₂/2) + ε₂ε₃/2 − 2, with ε₂ = 2π'/π and
   * ε₂ε₃ = 2π''/π − ε₂²/2 from the background equation (Hubble-flow functions as in
   * test/reference/odex-reference.ts).
   */
  private scalarMassBeyondDeSitter(phi: number, pi: number): number {
    const p = this.potential;
    const V = p.V(phi);
    const v1 = p.dV(phi) / V;
    const e1 = 0.5 * pi * pi;
    const piPrime = -(3 - e1) * (pi + v1);
    const piSecond = pi * piPrime * (pi + v1) - (3 - e1) * (piPrime + (p.d2V(phi) / V - v1 * v1) * pi);
    const e2 = (2 * piPrime) / pi;
    const e2e3 = (2 * piSecond) / pi - 0.5 * e2 * e2;
    return (1 + e2 / 2) * (2 - e1 + e2 / 2) + e2e3 / 2 - 2;
  }

  /** The background at N re-integrated from the stored node before it: an interpolated start state would shift an oscillating background's phase. */
  private backgroundAt(bg: BackgroundSolution, N: number): number {
    const t = bg.table;
    const i = t.locate(N);
    const s = this.backgroundOnly;
    this.bg[0] = t.phi[i];
    this.bg[1] = t.pi[i];
    s.reset(t.n[i], this.bg, Math.min(0.05, N - t.n[i] || 0.05));
    for (let guard = 0; s.t < N && guard < 100_000; guard++) {
      if (s.step(N) !== 'ok') {
        bg.table.interpolate(N, this.bg);
        return s.evaluations;
      }
    }
    this.bg[0] = s.y[0];
    this.bg[1] = s.y[1];
    return s.evaluations;
  }

  /** Integrates one mode k (in units of k_*) from k/aH = depth; returns P_R, and P_t when withTensor. */
  private mode(bg: BackgroundSolution, lnK: number, depth: number, withTensor: boolean, budget: BudgetMeter): { scalar: number; tensor: number; evaluations: number } | Failure {
    const { endDepth } = this.options;
    this.k = Math.exp(lnK);
    const nStart = this.crossing(bg, lnK - Math.log(depth));
    const startEvaluations = this.backgroundAt(bg, nStart);
    const phi = this.bg[0];
    const pi = this.bg[1];
    const lnAH0 = this.lnAH(nStart, phi, pi);
    if (lnK - lnAH0 < Math.log(depth) - 1e-6) {
      // Here nStart = 0; aH grows by e^{1−ε₁} per e-fold, so each missing factor e in depth is about one e-fold.
      const needed = this.nPivot + Math.log(depth) - (lnK - lnAH0);
      return failure('pivot_too_early', `the modes need to start ${fmt(needed)} e-folds before the pivot (k/aH = ${fmt(depth)}) but the background starts only ${fmt(this.nPivot)} e-folds before it; start further up the potential`, { nTotal: bg.nEnd });
    }
    let nStop = this.crossing(bg, lnK - Math.log(endDepth));
    if (nStop > bg.nEnd) nStop = bg.nEnd;

    const k = this.k;
    const x = Math.exp(lnK - lnAH0);
    const V = this.potential.V(phi);
    const e1 = 0.5 * pi * pi;
    const piPrime = -(3 - e1) * (pi + this.potential.dV(phi) / V);
    const e2 = (2 * piPrime) / pi;
    const H = Math.sqrt(V / (3 - e1));
    const a = Math.exp(lnAH0) / H;
    const aH = a * H;
    const norm = 1 / Math.sqrt(2 * k);
    // v = (1 + i/x)/√(2k), dv/dτ = (−ik + k/x + ik/x²)/√(2k) at kτ = −x (phase set to 1), dv/dN = (dv/dτ)/(aH).
    const vr = norm;
    const vi = norm / x;
    const vNr = (norm * k) / x / aH;
    const vNi = (norm * (-k + k / (x * x))) / aH;
    const z = a * Math.sqrt(2 * e1);
    const zN = 1 + e2 / 2; // z_N / z
    // A start deepened for an oscillating background adds to the de Sitter state the first
    // adiabatic correction for the rest of the mass term, δZ = (z''/z)/(aH)² − 2: without it the
    // start errs by ~δZ/(k/aH)², and δZ ≈ 3V''/V oscillates with amplitudes up to thousands.
    // A start at startDepth keeps the plain state (its error, < 1e-5, is checked in convergence.spec).
    const deepened = depth > this.options.startDepth;
    const y = this.start;
    y[0] = phi;
    y[1] = pi;
    const scalarMass = deepened ? this.scalarMassBeyondDeSitter(phi, pi) : 0;
    const v = adiabaticState(vr, vi, vNr, vNi, scalarMass, x);
    y[2] = v[0] / z;
    y[3] = v[1] / z;
    y[4] = (v[2] - v[0] * zN) / z;
    y[5] = (v[3] - v[1] * zN) / z;
    // h = 2v/a, h_N = 2(v_N − v)/a; the tensor mass term (a''/a)/(aH)² = 2 − ε₁.
    const vt = adiabaticState(vr, vi, vNr, vNi, deepened ? -e1 : 0, x);
    y[6] = (2 * vt[0]) / a;
    y[7] = (2 * vt[1]) / a;
    y[8] = (2 * (vt[2] - vt[0])) / a;
    y[9] = (2 * (vt[3] - vt[1])) / a;

    const s = withTensor ? this.both : this.scalar;
    s.reset(nStart, y, 0.01);
    for (let guard = 0; s.t < nStop; guard++) {
      const result = s.step(nStop);
      if (result !== 'ok' || guard > 200_000) {
        // Say what stopped it: the step limit, or what the integrator reported.
        const why = result === 'ok' ? 'it took more than 200,000 steps' : result === 'underflow' ? 'the step size underflowed' : 'it produced non-finite values';
        return failure('integration_failed', `a mode equation (k = ${fmt(k)} k_*) could not be integrated near N = ${fmt(s.t)}: ${why}`, { nTotal: bg.nEnd });
      }
      const over = budget.exceeded(startEvaluations + s.evaluations, 0);
      if (over) return budget.failure(over, `in the mode equations (k = ${fmt(k)} k_*)`, { n: s.t, phi: s.y[0], pi: s.y[1] });
    }
    const evaluations = startEvaluations + s.evaluations;
    budget.spent += evaluations;
    const k3 = k * k * k;
    const scalar = (k3 * (s.y[2] * s.y[2] + s.y[3] * s.y[3])) / TWO_PI2;
    const tensor = withTensor ? (2 * k3 * (s.y[6] * s.y[6] + s.y[7] * s.y[7])) / TWO_PI2 : NaN;
    return { scalar, tensor, evaluations };
  }

  solve(
    potential: PotentialFunctions,
    bg: BackgroundSolution,
    nPivot: number,
    pivotState: { phi: number; pi: number },
    spectrumLnK?: readonly number[],
    budget: BudgetMeter = new BudgetMeter(),
  ): ExactObservables | Failure {
    this.potential = potential;
    this.nPivot = nPivot;
    this.lnHPivot = 0.5 * Math.log(potential.V(pivotState.phi) / (3 - 0.5 * pivotState.pi * pivotState.pi));
    const d = this.options.stencil;
    const offsets = [-2 * d, -d, 0, d, 2 * d];
    const stencilDepth = this.startDepthFor(bg, -2 * d, 2 * d);
    const lnP: number[] = [];
    let evaluations = 0;
    let As = NaN;
    let Pt = NaN;
    for (const off of offsets) {
      const m = this.mode(bg, off, stencilDepth, off === 0, budget);
      if ('status' in m) return m;
      evaluations += m.evaluations;
      lnP.push(Math.log(m.scalar));
      if (off === 0) {
        As = m.scalar;
        Pt = m.tensor;
      }
    }
    // Five-point central differences in ln k, fourth-order accurate: a spectrum with features
    // (oscillations of period ~0.6 in ln k, steps) needs that; a three-point stencil wide enough
    // to keep integration noise out of α_s misses them by ~1e-4.
    const ns = 1 + (lnP[0] - 8 * lnP[1] + 8 * lnP[3] - lnP[4]) / (12 * d);
    const alphaS = (-lnP[0] + 16 * lnP[1] - 30 * lnP[2] + 16 * lnP[3] - lnP[4]) / (12 * d * d);
    const featureResidual = powerLawResidual(offsets, lnP);
    const result: ExactObservables = { ns, alphaS, r: Pt / As, As, Pt, featureResidual, evaluations };
    if (spectrumLnK) {
      const spectrum = { lnK: [...spectrumLnK], scalar: [] as number[], tensor: [] as number[] };
      for (const lnK of spectrumLnK) {
        const m = this.mode(bg, lnK, this.startDepthFor(bg, lnK, lnK), true, budget);
        if ('status' in m) return m;
        evaluations += m.evaluations;
        spectrum.scalar.push(m.scalar);
        spectrum.tensor.push(m.tensor);
      }
      result.spectrum = spectrum;
      result.evaluations = evaluations;
    }
    return result;
  }
}
