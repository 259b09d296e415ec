/**
 * An independent reference solution of single-field inflation, for checking the engine.
 *
 * Nothing here uses the engine's integrator (Cash-Karp), its background table, its Hermite
 * interpolation, its Hubble-flow code or its mode equations. The only thing shared with the
 * engine is V(φ) and its derivatives, which the tests take from the engine's compiled
 * expressions (checked separately against hand-written derivatives in
 * src/engine/expression/compile-potential.spec.ts) — any object with V, dV and d2V will do.
 *
 * Integrator: ODEX, the Gragg-Bulirsch-Stoer extrapolation method of Hairer & Wanner
 * (Hairer, Nørsett & Wanner, "Solving Ordinary Differential Equations I", 2nd ed., Springer
 * 1993, section II.9), as ported to JavaScript in the `odex` package (v2.0.4,
 * node_modules/odex/src/odex.ts), with its dense output (section II.9, "dense output for the
 * GBS method") for locating the end of inflation.
 *
 * Physics (M_pl = 1, e-folds N as time, ' = d/dN):
 *
 *  Background — Klein-Gordon and Friedmann equations with dN = H dt, state (φ, π = φ'):
 *    ε₁ = π²/2,  H² = V/(3 − ε₁),  π' = −(3 − ε₁)(π + V'/V).
 *  Hubble-flow functions (Schwarz, Terrero-Escalante & Garcia 2001, Phys. Lett. B 517, 243,
 *  astro-ph/0106020): ε₁ = −d ln H/dN, ε_{n+1} = d ln|ε_n|/dN, so here
 *    ε₂ = 2π'/π,   ε₂ε₃ = ε₂' = 2π''/π − ε₂²/2,
 *    π'' = ε₁'(π + V'/V) − (3 − ε₁)(π' + (V''/V − (V'/V)²)π),   ε₁' = ππ'.
 *  ε₂ε₃ is used as a product (never ε₃ alone), so ε₂ = 0 (an inflection of ln ε₁) is harmless.
 *
 *  Perturbations — Mukhanov-Sasaki variables (Mukhanov, Feldman & Brandenberger 1992,
 *  Phys. Rep. 215, 203; Sasaki 1986, Prog. Theor. Phys. 76, 1036): in conformal time τ,
 *    v_k'' + (k² − z''/z) v_k = 0,  z = a√(2ε₁) for curvature (ζ = v/z),
 *                                    z_T = a for each tensor polarisation (h = 2v_T/a).
 *  With d/dτ = aH d/dN and d ln(aH)/dN = 1 − ε₁ this is, in N,
 *    v_NN + (1 − ε₁) v_N + [(k/aH)² − Z] v = 0,
 *  with, from z_N/z = 1 + ε₂/2 and z_NN/z = (z_N/z)² + (z_N/z)_N,
 *    Z_s = (z''/z)/(aH)² = (1 − ε₁)(1 + ε₂/2) + (1 + ε₂/2)² + ε₂ε₃/2
 *        = (1 + ε₂/2)(2 − ε₁ + ε₂/2) + ε₂ε₃/2,
 *    Z_t = (a''/a)/(aH)² = 2 − ε₁.
 *  The engine instead integrates ζ and h with friction terms (3 − ε₁ + ε₂) and (3 − ε₁): the
 *  two forms are related by v = zζ, which is itself worth checking.
 *  Initial state: the first-order WKB (adiabatic) vacuum, which matches the Bunch-Davies state
 *  deep inside the horizon (Birrell & Davies 1982, "Quantum fields in curved space", ch. 3):
 *    v = 1/√(2ω),  v_N = v (−iΩ + (1 − ε₁) Z/(2Ω²)),  ω² = k² − (aH)² Z,  Ω = ω/(aH),
 *  started at k/aH = 200 (the engine: de Sitter mode functions, started shallower); Z_N is dropped,
 *  an error of order ε²/(k/aH)² ≈ 1e-9. The modes are followed to k/aH = 1e-4 (the engine:
 *  1e-3), where P_R = k³|v/z|²/(2π²) and P_t = 2·k³|2v_T/a|²/(2π²) have frozen to O((k/aH)²).
 *  The scale factor is normalised so that aH = k_* = 1 at the pivot, N_* e-folds before the end.
 *  n_s − 1 and α_s are the first and second derivatives of ln P_R in ln k from a five-point
 *  central stencil of spacing 0.15 (truncation O(h⁴); the engine: three points, wider).
 */

// The `odex` package ships its TypeScript source (odex.ts) as the module's types, and that file
// does not compile under this project's strict settings. Importing it through a specifier typed
// as `string` keeps tsc from resolving (and type-checking) it; the structural types below
// describe the part of its API used here, as declared in node_modules/odex/src/odex.ts.
const ODEX_MODULE: string = 'odex';

/** Dense output of the last accepted step: component c at x in [xOld, x]. */
type DenseOutput = (c: number, x: number) => number;
type OdexCallback = (nr: number, xOld: number, x: number, y: number[], dense?: DenseOutput) => boolean | void;
interface OdexSolver {
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(
    f: (x: number, y: number[]) => number[],
    x0: number,
    y0: number[],
    x1: number,
    callback?: OdexCallback,
  ): { y: number[]; outcome: number; nStep: number; nAccept: number; nReject: number; nEval: number };
}
const odex = (await import(ODEX_MODULE)) as { Solver: new (n: number) => OdexSolver; Outcome: Record<string, number> };
const CONVERGED: number = odex.Outcome.Converged;

/** What the reference needs of a potential (M_pl = 1). */
export interface ReferencePotential {
  V(phi: number): number;
  dV(phi: number): number;
  d2V(phi: number): number;
}

export interface ReferenceOptions {
  /** Relative tolerance of every odex integration. */
  relativeTolerance: number;
  /** Modes start at k/aH = startDepth. */
  startDepth: number;
  /** Modes stop at k/aH = endDepth. */
  endDepth: number;
  /** Spacing in ln k of the five-point stencil. */
  stencil: number;
  /** Give up when inflation has not ended after this many e-folds. */
  maxEfolds: number;
}

export const REFERENCE_OPTIONS: ReferenceOptions = {
  relativeTolerance: 1e-12,
  startDepth: 200,
  endDepth: 1e-4,
  stencil: 0.15,
  maxEfolds: 1000,
};

const TWO_PI2 = 2 * Math.PI * Math.PI;
// Returned by a right-hand side outside the physical region (V ≤ 0, H² < 0 i.e. ε₁ ≥ 3, or a
// non-finite value), which a trial sub-step of a large extrapolation step can reach: odex's step
// then fails its overflow test (err·uRound ≥ 1) and is halved. NaN or Infinity must never be
// returned: odex's error test compares with `>`, so a NaN error estimate would be accepted.
// 1e100 keeps every sum in the extrapolation table, and the squared error, finite.
const REJECT = 1e100;

function physical(V: number, s: number, phi: number, pi: number): boolean {
  return V > 0 && Number.isFinite(V) && Number.isFinite(s) && Number.isFinite(phi) && 0.5 * pi * pi < 3;
}

function newSolver(n: number, rtol: number, atol: number | number[], dense: boolean, maxStep: number): OdexSolver {
  const s = new odex.Solver(n);
  s.relativeTolerance = rtol;
  s.absoluteTolerance = atol;
  s.denseOutput = dense;
  s.maxSteps = 1_000_000;
  s.initialStepSize = 1e-3;
  s.maxStepSize = maxStep;
  return s;
}

/** Background right-hand side (φ, π)' for N as time. */
function backgroundRhs(potential: ReferencePotential): (N: number, y: number[]) => number[] {
  return (_N, y) => {
    const V = potential.V(y[0]);
    const s = potential.dV(y[0]) / V;
    if (!physical(V, s, y[0], y[1])) return [REJECT, REJECT];
    return [y[1], -(3 - 0.5 * y[1] * y[1]) * (y[1] + s)];
  };
}

export interface ReferenceBackground {
  potential: ReferencePotential;
  phiInit: number;
  /** E-folds from φ_init to ε_H = 1 (NaN when integrated only to `stopAt`). */
  nEnd: number;
  phiEnd: number;
  piEnd: number;
  /** Accepted odex steps (N, φ, π) and dense-output samples between them, in order. */
  nodes: { N: number[]; phi: number[]; pi: number[] };
  /** Exact state at N: integrated afresh by odex from the last accepted step before N. */
  stateAt(N: number): { phi: number; pi: number };
}

/**
 * Background from φ_init on the slow-roll attractor π = −V'/V to ε_H = π²/2 = 1, which is
 * bracketed on odex's dense output by bisection inside the step where ε_H first reaches 1.
 * With `stopAt`, integrates to N = stopAt instead (for potentials in which inflation never ends).
 */
export function odexBackground(
  potential: ReferencePotential,
  phiInit: number,
  options: Partial<ReferenceOptions> & { stopAt?: number } = {},
): ReferenceBackground {
  const opts = { ...REFERENCE_OPTIONS, ...options };
  const rtol = opts.relativeTolerance;
  const f = backgroundRhs(potential);
  const y0 = [phiInit, -potential.dV(phiInit) / potential.V(phiInit)];
  if (!(0.5 * y0[1] * y0[1] < 1)) throw new Error(`reference: ε ≥ 1 at φ_init = ${phiInit}`);
  const step: { N: number[]; phi: number[]; pi: number[] } = { N: [], phi: [], pi: [] };
  const nodes: { N: number[]; phi: number[]; pi: number[] } = { N: [], phi: [], pi: [] };
  let nEnd = NaN;
  let phiEnd = NaN;
  let piEnd = NaN;
  const solver = newSolver(2, rtol, rtol * 1e-2, true, 1);
  const target = options.stopAt ?? opts.maxEfolds;
  const result = solver.solve(f, 0, y0, target, (_nr, xOld, x, y, dense) => {
    if (!Number.isFinite(y[0]) || !Number.isFinite(y[1]) || !(potential.V(y[0]) > 0)) {
      throw new Error(`reference: the background left the region V > 0 near N = ${x}, φ = ${y[0]}`);
    }
    const sample = (upTo: number) => {
      for (let j = 1; dense && j <= 3; j++) {
        const Nj = xOld + ((x - xOld) * j) / 4;
        if (Nj >= upTo) break;
        nodes.N.push(Nj);
        nodes.phi.push(dense(0, Nj));
        nodes.pi.push(dense(1, Nj));
      }
    };
    if (options.stopAt === undefined && dense && 0.5 * y[1] * y[1] >= 1) {
      // Bisection on the dense output for ε_H(N) = 1 inside [xOld, x].
      let lo = xOld;
      let hi = x;
      for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); i++) {
        const mid = 0.5 * (lo + hi);
        const p = dense(1, mid);
        if (0.5 * p * p >= 1) hi = mid;
        else lo = mid;
      }
      nEnd = 0.5 * (lo + hi);
      phiEnd = dense(0, nEnd);
      piEnd = dense(1, nEnd);
      sample(nEnd);
      nodes.N.push(nEnd);
      nodes.phi.push(phiEnd);
      nodes.pi.push(piEnd);
      return false;
    }
    sample(x);
    step.N.push(x);
    step.phi.push(y[0]);
    step.pi.push(y[1]);
    nodes.N.push(x);
    nodes.phi.push(y[0]);
    nodes.pi.push(y[1]);
    return true;
  });
  if (options.stopAt === undefined && Number.isNaN(nEnd)) {
    throw new Error(`reference: inflation did not end within ${opts.maxEfolds} e-folds (odex outcome ${result.outcome})`);
  }
  if (options.stopAt !== undefined && result.outcome !== CONVERGED) {
    throw new Error(`reference: odex did not reach N = ${options.stopAt} (outcome ${result.outcome})`);
  }

  const stepper = newSolver(2, rtol, rtol * 1e-2, false, 1);
  const stateAt = (N: number): { phi: number; pi: number } => {
    // Last accepted step at or before N (step.N[0] = 0 is the initial state).
    let lo = 0;
    let hi = step.N.length - 1;
    if (N >= step.N[hi]) lo = hi;
    else {
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (step.N[mid] <= N) lo = mid;
        else hi = mid;
      }
    }
    if (N === step.N[lo]) return { phi: step.phi[lo], pi: step.pi[lo] };
    const r = stepper.solve(f, step.N[lo], [step.phi[lo], step.pi[lo]], N);
    if (r.outcome !== CONVERGED) throw new Error(`reference: odex could not reach N = ${N}`);
    return { phi: r.y[0], pi: r.y[1] };
  };
  return { potential, phiInit, nEnd, phiEnd, piEnd, nodes, stateAt };
}

/** ε₁, ε₂, ε₂ε₃ and H² at (φ, π), from the equations of motion (see the header). */
export function flow(potential: ReferencePotential, phi: number, pi: number): { e1: number; e2: number; e2e3: number; H2: number; piN: number } {
  const V = potential.V(phi);
  const s = potential.dV(phi) / V;
  const sN = (potential.d2V(phi) / V - s * s) * pi; // d(V'/V)/dN
  const e1 = 0.5 * pi * pi;
  const piN = -(3 - e1) * (pi + s);
  const e1N = pi * piN;
  const piNN = e1N * (pi + s) - (3 - e1) * (piN + sN);
  const e2 = (2 * piN) / pi;
  const e2e3 = (2 * piNN) / pi - 0.5 * e2 * e2;
  return { e1, e2, e2e3, H2: V / (3 - e1), piN };
}

export interface ReferenceSpectra {
  ns: number;
  alphaS: number;
  r: number;
  /** P_R(k_*) for the potential as given. */
  As: number;
  Pt: number;
  nPivot: number;
  phiStar: number;
  piStar: number;
  /** ln k/k_* of the stencil and ln P_R there. */
  lnK: number[];
  lnP: number[];
}

/**
 * Scalar and tensor spectra at the pivot N = nPivot (aH = k_* = 1 there) from the
 * Mukhanov-Sasaki equations in the u-form above, integrated with the background by odex.
 */
export function odexSpectra(bg: ReferenceBackground, nPivot: number, options: Partial<ReferenceOptions> = {}): ReferenceSpectra {
  const opts = { ...REFERENCE_OPTIONS, ...options };
  const potential = bg.potential;
  const pivot = bg.stateAt(nPivot);
  const halfLnH2Pivot = 0.5 * Math.log(flow(potential, pivot.phi, pivot.pi).H2);
  const lnAH = (N: number, phi: number, pi: number) =>
    N - nPivot + 0.5 * Math.log(potential.V(phi) / (3 - 0.5 * pi * pi)) - halfLnH2Pivot;

  // Approximate ln(aH)(N) on the stored nodes (linear in between): only used to choose where a
  // mode starts and stops; the mode itself is always started from the exact state.
  const nodes = bg.nodes;
  const lnAHNodes = nodes.N.map((N, i) => lnAH(N, nodes.phi[i], nodes.pi[i]));
  const crossing = (target: number): number => {
    let lo = 0;
    let hi = nodes.N.length - 1;
    if (!(lnAHNodes[lo] <= target && target <= lnAHNodes[hi])) {
      throw new Error(`reference: ln(aH) = ${target} is outside the integrated background [${lnAHNodes[lo]}, ${lnAHNodes[hi]}]`);
    }
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (lnAHNodes[mid] <= target) lo = mid;
      else hi = mid;
    }
    const u = (target - lnAHNodes[lo]) / (lnAHNodes[hi] - lnAHNodes[lo]);
    return nodes.N[lo] + u * (nodes.N[hi] - nodes.N[lo]);
  };

  const mode = (lnKValue: number): { scalar: number; tensor: number } => {
    const k = Math.exp(lnKValue);
    const nStart = crossing(lnKValue - Math.log(opts.startDepth));
    const nStop = crossing(lnKValue - Math.log(opts.endDepth));
    const s0 = bg.stateAt(nStart);
    const fl = flow(potential, s0.phi, s0.pi);
    const lnAH0 = lnAH(nStart, s0.phi, s0.pi);
    const aH = Math.exp(lnAH0);
    const x = k / aH;
    // WKB vacuum for each of the two equations (Z_s for curvature, Z_t for tensors).
    const zS = (1 + fl.e2 / 2) * (2 - fl.e1 + fl.e2 / 2) + fl.e2e3 / 2;
    const zT = 2 - fl.e1;
    const vacuum = (Z: number): number[] => {
      const Omega = Math.sqrt(x * x - Z);
      const amp = 1 / Math.sqrt(2 * Omega * aH); // 1/√(2ω), ω = Ω·aH
      const re = ((1 - fl.e1) * Z) / (2 * Omega * Omega);
      // v = amp (phase 1), v_N = v (re − iΩ)
      return [amp, 0, amp * re, -amp * Omega];
    };
    const y0 = [s0.phi, s0.pi, ...vacuum(zS), ...vacuum(zT)];
    const rhs = (N: number, y: number[]): number[] => {
      const phi = y[0];
      const pi = y[1];
      const V = potential.V(phi);
      if (!physical(V, potential.dV(phi) / V, phi, pi) || !y.every(Number.isFinite)) return new Array<number>(10).fill(REJECT);
      const g = flow(potential, phi, pi);
      const ahLn = N - nPivot + 0.5 * Math.log(g.H2) - halfLnH2Pivot;
      const x2 = Math.exp(2 * (lnKValue - ahLn));
      const friction = 1 - g.e1;
      const ms = x2 - ((1 + g.e2 / 2) * (2 - g.e1 + g.e2 / 2) + g.e2e3 / 2);
      const mt = x2 - (2 - g.e1);
      return [
        pi,
        g.piN,
        y[4],
        y[5],
        -friction * y[4] - ms * y[2],
        -friction * y[5] - ms * y[3],
        y[8],
        y[9],
        -friction * y[8] - mt * y[6],
        -friction * y[9] - mt * y[7],
      ];
    };
    const rtol = opts.relativeTolerance;
    const vScale = 1 / Math.sqrt(2 * k);
    const atol = [rtol * 1e-2, rtol * 1e-2 * Math.abs(s0.pi), ...new Array<number>(8).fill(rtol * 1e-2 * vScale)];
    const solver = newSolver(10, rtol, atol, false, 0.5);
    const res = solver.solve(rhs, nStart, y0, nStop);
    if (res.outcome !== CONVERGED) throw new Error(`reference: a mode did not converge (lnK = ${lnKValue})`);
    const y = res.y;
    const H2 = potential.V(y[0]) / (3 - 0.5 * y[1] * y[1]);
    const a = Math.exp(lnAH(nStop, y[0], y[1])) / Math.sqrt(H2);
    const z = a * Math.abs(y[1]);
    const k3 = k * k * k;
    const scalar = (k3 * (y[2] * y[2] + y[3] * y[3])) / (z * z) / TWO_PI2;
    const tensor = (2 * k3 * 4 * (y[6] * y[6] + y[7] * y[7])) / (a * a) / TWO_PI2;
    return { scalar, tensor };
  };

  const h = opts.stencil;
  const lnK = [-2 * h, -h, 0, h, 2 * h];
  const lnP: number[] = [];
  let As = NaN;
  let Pt = NaN;
  for (const l of lnK) {
    const m = mode(l);
    lnP.push(Math.log(m.scalar));
    if (l === 0) {
      As = m.scalar;
      Pt = m.tensor;
    }
  }
  // Five-point central differences (Fornberg 1988, Math. Comp. 51, 699): error O(h⁴).
  const d1 = (lnP[0] - 8 * lnP[1] + 8 * lnP[3] - lnP[4]) / (12 * h);
  const d2 = (-lnP[0] + 16 * lnP[1] - 30 * lnP[2] + 16 * lnP[3] - lnP[4]) / (12 * h * h);
  return { ns: 1 + d1, alphaS: d2, r: Pt / As, As, Pt, nPivot, phiStar: pivot.phi, piStar: pivot.pi, lnK, lnP };
}

/** Background to the end, pivot N_* e-folds before it, and the spectra there. */
export function odexReference(
  potential: ReferencePotential,
  phiInit: number,
  nStar: number,
  options: Partial<ReferenceOptions> = {},
): ReferenceSpectra & { background: ReferenceBackground } {
  const background = odexBackground(potential, phiInit, options);
  if (!(background.nEnd > nStar)) throw new Error(`reference: only ${background.nEnd} e-folds, fewer than N_* = ${nStar}`);
  return { ...odexSpectra(background, background.nEnd - nStar, options), background };
}
