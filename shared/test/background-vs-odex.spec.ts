import { describe, expect, it } from 'vitest';
import { RequestEvaluator } from '../src/engine/evaluate-request.js';
import { POTENTIAL_FAMILIES, type PotentialFamily } from '../src/engine/families/potential-families.js';
import { type CompiledPotential } from '../src/engine/expression/index.js';
import { flow, odexBackground, type ReferenceBackground } from './reference/odex-reference.js';
import { compile } from './support/compile.js';

// The engine's background (Cash-Karp, src/engine/background/background.ts) against a second,
// general-purpose integrator from the registries: ODEX, Gragg-Bulirsch-Stoer extrapolation
// (Hairer, Nørsett & Wanner, Solving ODEs I, §II.9; npm `odex` 2.0.4), driven by
// test/reference/odex-reference.ts. Same equations (Klein-Gordon + Friedmann in e-folds),
// different integrator, different end-of-inflation search (bisection on odex's dense output),
// different pivot-state evaluation (odex integration from its own last accepted step).

const N_STAR = 55;


function family(key: string): PotentialFamily {
  const f = POTENTIAL_FAMILIES.find((x) => x.key === key);
  if (!f) throw new Error(`no family ${key}`);
  return f;
}

interface Case {
  label: string;
  key: string;
  params: Record<string, number>;
}

// The families of the brief; parameters not given are the family defaults.
const CASES: Case[] = [
  { label: 'quadratic (monomial p = 2)', key: 'monomial', params: { p: 2 } },
  { label: 'Starobinsky', key: 'starobinsky', params: {} },
  { label: 'natural, f = 7', key: 'natural', params: { f: 7 } },
  { label: 'hilltop quartic', key: 'hilltop-quartic', params: {} },
  { label: 'α-attractor T-model', key: 'alpha-t', params: {} },
  { label: 'double well', key: 'double-well', params: {} },
];

interface Prepared {
  potential: CompiledPotential;
  phiInit: number;
  params: Record<string, number>;
  bg: ReferenceBackground;
  phiStar: number;
}

const prepared = new Map<string, Prepared>();
function prepare(c: Case): Prepared {
  let p = prepared.get(c.label);
  if (!p) {
    const f = family(c.key);
    const params = { ...Object.fromEntries(f.parameters.map((q) => [q.name, q.defaultValue])), ...c.params };
    const potential = compile(f.expression, params);
    // The family's own default start (src/engine/families/potential-families.ts), as the engine uses.
    const phiInit = f.phiInit(params, potential);
    const bg = odexBackground(potential, phiInit);
    p = { potential, phiInit, params, bg, phiStar: bg.stateAt(bg.nEnd - N_STAR).phi };
    prepared.set(c.label, p);
  }
  return p;
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('odex reference background: self-checks', () => {
  it.each(CASES)('$label: ε_H = 1 at the located end, re-integrated afresh (dense-output bisection is exact)', (c) => {
    const { bg } = prepare(c);
    // ε_H = π²/2 (Baumann, TASI lectures, arXiv:0907.5424) at N_end from a fresh odex
    // integration, not the dense output the end was bisected on.
    const end = bg.stateAt(bg.nEnd);
    expect(Math.abs(0.5 * end.pi * end.pi - 1)).toBeLessThan(1e-10);
    expect(relative(end.phi, bg.phiEnd)).toBeLessThan(1e-10);
    // Still inflating just before, at 1e-6 e-folds: ε_H rises monotonically through 1 there.
    const before = bg.stateAt(bg.nEnd - 1e-6);
    expect(0.5 * before.pi * before.pi).toBeLessThan(1);
  });

  it.each(CASES)('$label: converged in the odex tolerance (1e-10 against 1e-12)', (c) => {
    const { potential, phiInit, bg, phiStar } = prepare(c);
    // Global error of an extrapolation code scales with its tolerance (Hairer et al. §II.9):
    // a hundredfold looser run must agree far below the 1e-7 used against the engine.
    const loose = odexBackground(potential, phiInit, { relativeTolerance: 1e-10 });
    expect(relative(loose.nEnd, bg.nEnd)).toBeLessThan(1e-9);
    expect(relative(loose.phiEnd, bg.phiEnd)).toBeLessThan(1e-9);
    expect(relative(loose.stateAt(loose.nEnd - N_STAR).phi, phiStar)).toBeLessThan(1e-9);
  });

  it('an exact solution: V0 e^{−λφ} has the attractor π = λ, φ = φ₀ + λN (Lucchin & Matarrese 1985, PRD 32, 1316)', () => {
    const lambda = 0.3;
    const potential = compile('V0 * exp(-lambda * phi)', { V0: 1e-10, lambda });
    const bg = odexBackground(potential, 0, { stopAt: 90 });
    for (const N of [0.5, 17.3, 55, 89.9]) {
      const s = bg.stateAt(N);
      expect(Math.abs(s.phi - lambda * N)).toBeLessThan(1e-10 * Math.max(1, lambda * N));
      expect(Math.abs(s.pi - lambda)).toBeLessThan(1e-12);
    }
    // ε₂ = 0 exactly on this attractor; flow() must say so (Schwarz et al. 2001, astro-ph/0106020).
    const f = flow(potential, 3, lambda);
    expect(f.e1).toBeCloseTo((lambda * lambda) / 2, 15);
    expect(Math.abs(f.e2)).toBeLessThan(1e-14);
    expect(Math.abs(f.e2e3)).toBeLessThan(1e-14);
  });
});

describe('engine background against odex (N_* = 55, default φ_init)', () => {
  const evaluator = new RequestEvaluator();

  it.each(CASES)('$label: N_end within 3e-5 e-folds of odex, φ_* to 3e-7, φ_end to 5e-6 (engine default tolerance)', (c) => {
    const { params, bg, phiStar } = prepare(c);
    // Requirement of the issue: check the background "against a second general-purpose
    // integrator from the registries (odex)". The engine's default step tolerance (1e-6) is
    // chosen for speed with n_s in view: n_s moves by ~6e-4 per e-fold of error in the pivot
    // (common practice), so 3e-5 e-folds in N_end is ≤ 2e-8 in n_s. φ_end moves fastest,
    // |dφ/dN| = √2 at the end, so it carries the N_end error amplified.
    const e = evaluator.evaluate({ potential: c.key, params, nStar: N_STAR, method: 'slowroll' });
    expect(e.status, e.message).toBe('ok');
    const dN = Math.abs((e.nTotal as number) - bg.nEnd);
    const dEnd = relative(e.phiEnd as number, bg.phiEnd);
    const dStar = relative(e.phiStar as number, phiStar);
    const detail = `ΔN_end = ${dN.toExponential(2)}, Δφ_end/φ_end = ${dEnd.toExponential(2)}, Δφ_*/φ_* = ${dStar.toExponential(2)}`;
    expect(dN, detail).toBeLessThan(3e-5);
    expect(dEnd, detail).toBeLessThan(5e-6);
    expect(dStar, detail).toBeLessThan(3e-7);
  });

  it.each(CASES)('$label: at tolerance 1e-11 the engine converges onto odex (1e-10): the remaining gap is step error, not physics', (c) => {
    const { params, bg, phiStar } = prepare(c);
    // A difference in the equations or in the end condition would not shrink with the
    // engine's step tolerance; the Cash-Karp global error does (Cash & Karp 1990, ACM TOMS 16, 201).
    const e = evaluator.evaluate({ potential: c.key, params, nStar: N_STAR, method: 'slowroll', tolerance: 1e-11 });
    expect(e.status, e.message).toBe('ok');
    const dN = relative(e.nTotal as number, bg.nEnd);
    const dEnd = relative(e.phiEnd as number, bg.phiEnd);
    const dStar = relative(e.phiStar as number, phiStar);
    const detail = `ΔN_end/N_end = ${dN.toExponential(2)}, Δφ_end/φ_end = ${dEnd.toExponential(2)}, Δφ_*/φ_* = ${dStar.toExponential(2)}`;
    expect(dN, detail).toBeLessThan(1e-10);
    expect(dEnd, detail).toBeLessThan(1e-10);
    expect(dStar, detail).toBeLessThan(1e-10);
  });
});
