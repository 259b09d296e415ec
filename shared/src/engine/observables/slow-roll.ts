import { STEWART_LYTH_C } from '../constants.js';
import { CashKarpStepper } from '../integrators/cash-karp.js';
import { fmt, type PotentialFunctions } from '../types.js';

export interface SlowRollObservables {
  epsilonV: number;
  etaV: number;
  xi2V: number;
  ns: number;
  r: number;
  alphaS: number;
  nt: number;
  /** A_s = V/(24π² ε_V) for the potential as given (before normalisation). */
  As: number;
}

/**
 * First-order potential slow roll at φ_* (Liddle, Parsons & Barrow 1994, astro-ph/9408015):
 * ε_V = (V'/V)²/2, η_V = V''/V, ξ²_V = V'V'''/V²; n_s = 1 − 6ε_V + 2η_V, r = 16ε_V,
 * n_t = −r/8, α_s = 16ε_Vη_V − 24ε_V² − 2ξ²_V (Kosowsky & Turner 1995, astro-ph/9504071),
 * A_s = V/(24π²ε_V).
 */
export function potentialSlowRoll(potential: PotentialFunctions, phi: number): SlowRollObservables {
  const V = potential.V(phi);
  const v1 = potential.dV(phi) / V;
  const epsilonV = 0.5 * v1 * v1;
  const etaV = potential.d2V(phi) / V;
  const xi2V = v1 * (potential.d3V(phi) / V);
  return {
    epsilonV,
    etaV,
    xi2V,
    ns: 1 - 6 * epsilonV + 2 * etaV,
    r: 16 * epsilonV,
    alphaS: 16 * epsilonV * etaV - 24 * epsilonV * epsilonV - 2 * xi2V,
    nt: -2 * epsilonV,
    As: V / (24 * Math.PI * Math.PI * epsilonV),
  };
}

export interface HubbleFlow {
  epsilon1: number;
  epsilon2: number;
  epsilon3: number;
  /** H² for the potential as given. */
  hubble2: number;
}

/**
 * Hubble-flow functions ε₁ = −Ḣ/H², ε_{n+1} = d ln|ε_n|/dN (Schwarz, Terrero-Escalante &
 * Garcia 2001, astro-ph/0106020) on the numerical background at (φ, π), from the equations
 * of motion rather than finite differences.
 */
export function hubbleFlow(potential: PotentialFunctions, phi: number, pi: number): HubbleFlow {
  const V = potential.V(phi);
  const v1 = potential.dV(phi) / V;
  const v2 = potential.d2V(phi) / V;
  const e1 = 0.5 * pi * pi;
  const f = v1 / pi; // V'/(Vπ)
  const piPrime = -(3 - e1) * (pi + v1);
  const e2 = -2 * (3 - e1) * (1 + f);
  const e1Prime = e1 * e2;
  const fPrime = (v2 - v1 * v1) - v1 * piPrime / (pi * pi);
  const e2Prime = 2 * e1Prime * (1 + f) - 2 * (3 - e1) * fPrime;
  return { epsilon1: e1, epsilon2: e2, epsilon3: e2Prime / e2, hubble2: V / (3 - e1) };
}

export interface SecondOrderObservables {
  ns: number;
  r: number;
  alphaS: number;
  As: number;
}

/**
 * Second-order slow roll (Stewart & Lyth 1993, Phys. Lett. B 302, 171, in the Hubble-flow form
 * of Schwarz et al. 2001 and Gong & Stewart 2001; coefficients from memory, checked in tests
 * against the exact mode equations): with C = γ_E + ln2 − 2,
 * n_s − 1 = −2ε₁ − ε₂ − 2ε₁² − (2C+3)ε₁ε₂ − Cε₂ε₃,  r = 16ε₁(1 + Cε₂),
 * α_s = −2ε₁ε₂ − ε₂ε₃,  P = H²/(8π²ε₁)·[1 − 2(C+1)ε₁ − Cε₂].
 */
export function secondOrderSlowRoll(flow: HubbleFlow): SecondOrderObservables {
  const { epsilon1: e1, epsilon2: e2, epsilon3: e3, hubble2 } = flow;
  const C = STEWART_LYTH_C;
  return {
    ns: 1 - 2 * e1 - e2 - 2 * e1 * e1 - (2 * C + 3) * e1 * e2 - C * e2 * e3,
    r: 16 * e1 * (1 + C * e2),
    alphaS: -2 * e1 * e2 - e2 * e3,
    As: (hubble2 / (8 * Math.PI * Math.PI * e1)) * (1 - 2 * (C + 1) * e1 - C * e2),
  };
}

/**
 * Where first-order slow roll stops being a description of the pivot (common practice: the
 * expansion needs ε_V, |η_V| and |ξ²_V| small; these bounds sit well above what every smooth
 * built-in family reaches at N_* = 50–60, ε_V ≤ 0.03, |η_V| ≤ 0.05, |ξ²_V| ≤ 0.002, and first and
 * second order then differ by at most 0.002 in n_s, measured in DEVELOPERS.md).
 */
export const SLOW_ROLL_REGIME = { epsilonV: 0.1, etaV: 0.2, xi2V: 0.02, nsOrders: 0.02 } as const;

/** Why slow roll is outside its regime at the pivot, with the numbers; null inside it. */
export function slowRollOutsideRegime(sr: SlowRollObservables, second: SecondOrderObservables): string | null {
  const limits = SLOW_ROLL_REGIME;
  const problems: string[] = [];
  if (!(sr.epsilonV <= limits.epsilonV)) problems.push(`ε_V = ${fmt(sr.epsilonV)} > ${limits.epsilonV}`);
  if (!(Math.abs(sr.etaV) <= limits.etaV)) problems.push(`|η_V| = ${fmt(Math.abs(sr.etaV))} > ${limits.etaV}`);
  if (!(Math.abs(sr.xi2V) <= limits.xi2V)) problems.push(`|ξ²_V| = ${fmt(Math.abs(sr.xi2V))} > ${limits.xi2V}`);
  const orders = Math.abs(sr.ns - second.ns);
  if (!(orders <= limits.nsOrders)) problems.push(`first and second order differ by ${fmt(orders)} in n_s (> ${limits.nsOrders})`);
  return problems.length ? problems.join(', ') : null;
}

/**
 * Slow-roll e-folds between two field values, N = ∫ V/|V'| dφ (the standard slow-roll count,
 * common practice), integrated adaptively with φ as the time variable, so a narrow near-flat
 * stretch is resolved; Infinity when V' vanishes or changes sign between them (the slow-roll
 * field never gets through).
 */
export function slowRollEfolds(potential: PotentialFunctions, from: number, to: number): number {
  const sign = Math.sign(potential.dV(from));
  if (sign === 0) return Infinity;
  let stalled = false;
  const stepper = new CashKarpStepper(1, (out, _y, phi) => {
    const dV = potential.dV(phi);
    if (Math.sign(dV) !== sign) stalled = true;
    out[0] = stalled ? 0 : potential.V(phi) / Math.abs(dV);
  }, { tolerance: 1e-8, maxStep: Math.abs(to - from) / 20 });
  stepper.reset(from, [0], (to - from) / 1000);
  for (let guard = 0; stepper.t !== to && guard < 100_000; guard++) {
    const result = stepper.step(to);
    if (stalled || result !== 'ok') return Infinity;
  }
  return Math.abs(stepper.y[0]);
}
