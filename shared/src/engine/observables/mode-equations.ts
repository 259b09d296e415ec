import type { BackgroundSolution } from '../background/background.js';
import { BudgetMeter } from '../budget.js';
import { CashKarpStepper } from '../integrators/cash-karp.js';
import { powerLawResidual } from './spectrum-shape.js';
import { failure, fmt, type Failure, type PotentialFunctions } from '../types.js';

export interface ModeOptions {
  /** Modes start at k/(aH) = this, deep inside the horizon (Bunch-Davies vacuum). */
  startDepth: number;
  /** Modes stop at k/(aH) = this, well outside the horizon where ζ and h are frozen. */
  endDepth: number;
  /** Step error tolerance of the mode integrations. */
  tolerance: number;
  /** Spacing in ln k of the five-point stencil around k_* for n_s and α_s. */
  stencil: number;
}

export const DEFAULT_MODE_OPTIONS: ModeOptions = { startDepth: 30, endDepth: 1e-3, tolerance: 3e-8, stencil: 0.1 };

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

/**
 * Exact scalar and tensor power spectra from the mode equations in e-folds,
 *   ζ'' + (3 − ε₁ + ε₂) ζ' + (k/aH)² ζ = 0,   h'' + (3 − ε₁) h' + (k/aH)² h = 0,
 * which are the Mukhanov-Sasaki equations (Mukhanov, Feldman & Brandenberger 1992, Phys. Rep.
 * 215, 203; Sasaki 1986) for ζ = v/z, z = a√(2ε₁), and for h = 2v_T/a, with N as time. Each mode
 * starts in the Bunch-Davies state v = e^{−ikτ}(1 − i/kτ)/√(2k) at k/aH = startDepth and is
 * integrated, together with the background (φ, π), until k/aH = endDepth. The scale factor is
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
  private readonly start = new Float64Array(10);
  private readonly bg = new Float64Array(2);

  constructor(private options: ModeOptions = DEFAULT_MODE_OPTIONS) {
    this.scalar = new CashKarpStepper(6, (out, y, t) => this.rhs(out, y, t, false), { tolerance: options.tolerance, maxStep: 0.25 });
    this.both = new CashKarpStepper(10, (out, y, t) => this.rhs(out, y, t, true), { tolerance: options.tolerance, maxStep: 0.25 });
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

  /** N at which ln(aH) reaches `target`, by bisection on the stored background (aH grows while ε₁ < 1). */
  private crossing(bg: BackgroundSolution, target: number): number {
    let lo = 0;
    let hi = bg.nEnd;
    for (let i = 0; i < 200 && hi - lo > 1e-13; i++) {
      const mid = 0.5 * (lo + hi);
      bg.table.interpolate(mid, this.bg);
      if (this.lnAH(mid, this.bg[0], this.bg[1]) < target) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  }

  /** Integrates one mode k (in units of k_*); returns P_R, and P_t when withTensor. */
  private mode(bg: BackgroundSolution, lnK: number, withTensor: boolean, budget: BudgetMeter): { scalar: number; tensor: number; evaluations: number } | Failure {
    const { startDepth, endDepth } = this.options;
    this.k = Math.exp(lnK);
    const nStart = this.crossing(bg, lnK - Math.log(startDepth));
    bg.table.interpolate(nStart, this.bg);
    const phi = this.bg[0];
    const pi = this.bg[1];
    const lnAH0 = this.lnAH(nStart, phi, pi);
    if (lnK - lnAH0 < Math.log(startDepth) - 1e-6) {
      return failure('insufficient_efolds', `the exact method needs modes to start at k/aH = ${fmt(startDepth)}, i.e. about ${fmt(Math.log(startDepth))} e-folds before the pivot crossing, but the integration starts too late; choose φ_init further up the potential`, { nTotal: bg.nEnd });
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
    const y = this.start;
    y[0] = phi;
    y[1] = pi;
    y[2] = vr / z;
    y[3] = vi / z;
    y[4] = (vNr - vr * zN) / z;
    y[5] = (vNi - vi * zN) / z;
    // h = 2v/a, h_N = 2(v_N − v)/a
    y[6] = (2 * vr) / a;
    y[7] = (2 * vi) / a;
    y[8] = (2 * (vNr - vr)) / a;
    y[9] = (2 * (vNi - vi)) / a;

    const s = withTensor ? this.both : this.scalar;
    s.reset(nStart, y, 0.01);
    for (let guard = 0; s.t < nStop; guard++) {
      const result = s.step(nStop);
      if (result !== 'ok' || guard > 200_000) {
        return failure('integration_failed', `a mode equation could not be integrated near N = ${fmt(s.t)} (${result})`, { nTotal: bg.nEnd });
      }
      const over = budget.exceeded(s.evaluations, 0);
      if (over) return budget.failure(over, `in the mode equations (k = ${fmt(k)} k_*)`, { n: s.t, phi: s.y[0], pi: s.y[1] });
    }
    budget.spent += s.evaluations;
    const k3 = k * k * k;
    const scalar = (k3 * (s.y[2] * s.y[2] + s.y[3] * s.y[3])) / TWO_PI2;
    const tensor = withTensor ? (2 * k3 * (s.y[6] * s.y[6] + s.y[7] * s.y[7])) / TWO_PI2 : NaN;
    return { scalar, tensor, evaluations: s.evaluations };
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
    const lnP: number[] = [];
    let evaluations = 0;
    let As = NaN;
    let Pt = NaN;
    for (const off of offsets) {
      const m = this.mode(bg, off, off === 0, budget);
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
        const m = this.mode(bg, lnK, true, budget);
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
