/**
 * Where the modes start (ModeSolver.startDepthFor): deep enough inside the horizon for the
 * background each mode meets, deeper when the background oscillates.
 *
 * The references are an independent integration: same equations started deeper. Either every
 * mode starts at a fixed k/aH = 3000 in the plain Bunch-Davies state (no start criterion and no
 * adiabatic correction involved), or the criterion's safety factors are raised so that every
 * start lies 2 or 4 times deeper than the default chooses.
 */
import { describe, expect, it } from 'vitest';
import { PointEvaluator, type PointResult } from '../src/engine/evaluate-point.js';
import { findFamily } from '../src/engine/families/potential-families.js';
import type { ModeOptions } from '../src/engine/observables/mode-equations.js';
import type { PotentialFunctions } from '../src/engine/types.js';
import { compile } from './support/compile.js';

interface Case {
  label: string;
  potential: PotentialFunctions;
  phiInit: number;
  nStar: number;
  /** Background tolerance (default 1e-6). */
  tolerance?: number;
}

/** The default start criterion, 2 or 4 times deeper wherever it deepens the start. */
const deeper = (factor: number): Partial<ModeOptions> => ({ resonanceSafety: 4 * factor, adiabaticSafety: 1e5 * factor ** 3 });
/** Every mode at k/aH = 30 in the plain Bunch-Davies state: the start before the criterion. */
const NO_CRITERION: Partial<ModeOptions> = { resonanceSafety: 0, adiabaticSafety: 0 };

type Observables = Pick<PointResult, 'ns' | 'r' | 'alphaS' | 'As'>;

/**
 * The mode equations' numbers for a case. Most of these spectra oscillate across the stencil, so
 * the point is refused as `spectrum_feature`; the numbers it computed come with the refusal.
 */
function exact(c: Case, modes: Partial<ModeOptions> = {}): Observables {
  const result = new PointEvaluator(modes).evaluate({ potential: c.potential, phiInit: c.phiInit, nStar: c.nStar, method: 'exact', tolerance: c.tolerance });
  if (result.status === 'ok') return result;
  if (result.status === 'spectrum_feature' && result.observables) return result.observables;
  throw new Error(`${c.label}: ${result.message}`);
}

function expectAgreement(result: Observables, reference: Observables): void {
  expect(Math.abs(result.ns - reference.ns)).toBeLessThan(1e-4);
  expect(Math.abs(result.As / reference.As - 1)).toBeLessThan(5e-3);
  expect(Math.abs(result.r / reference.r - 1)).toBeLessThan(5e-3);
}

const monodromy = findFamily('monodromy-modulated')!;
/** The family's potential with modulation depth b = Λ⁴/(μ³f) (local minima appear from b = 1). */
function monodromyCase(b: number, f: number, nStar: number, tolerance?: number): Case {
  const params = { mu3: 1e-10, Lambda4: b * 1e-10 * f, f };
  const potential = compile(monodromy.expression, params);
  return { label: `monodromy-modulated b = ${b}, f = ${f}, N_* = ${nStar}`, potential, phiInit: monodromy.phiInit(params, potential), nStar, tolerance };
}

const OSCILLATING: Case[] = [
  monodromyCase(0.05, 1e-3, 55),
  monodromyCase(0.05, 3e-4, 55),
  { label: 'φ²(1 + 1e-5 sin(1e3 φ))', potential: compile('phi^2 * (1 + 1e-5 * sin(1e3 * phi))', {}), phiInit: 16, nStar: 55 },
];

describe('oscillating backgrounds: modes start beyond the resonance', () => {
  it.each(OSCILLATING)('$label agrees with every mode started at k/aH = 3000 (1e-4 in n_s, 0.5 % in A_s and r)', (c) => {
    const reference = exact(c, { startDepth: 3000 });
    expectAgreement(exact(c), reference);
    // The start at k/aH = 30 missed the resonance: A_s and r off by 1.8–4.3 %, n_s by 9e-4 to 0.1.
    const shallow = exact(c, NO_CRITERION);
    expect(Math.abs(shallow.As / reference.As - 1)).toBeGreaterThan(0.01);
    expect(Math.abs(shallow.r / reference.r - 1)).toBeGreaterThan(0.01);
    expect(Math.abs(shallow.ns - reference.ns)).toBeGreaterThan(5e-4);
  });

  it.each(OSCILLATING)('$label: starting 4 times deeper changes nothing beyond tolerance', (c) => {
    expectAgreement(exact(c), exact(c, deeper(4)));
  });
});

describe('monodromy-modulated over its whole range', () => {
  // A tight background (1e-10) isolates the start: for f ≲ 3e-4 and b ≳ 0.5 the oscillation's
  // phase at the pivot, and so n_s, moves by up to 5e-2 with the background's own tolerance.
  // b from 0.01 to 0.9 (minima from b = 1), f from the family's 1e-4 to its 10, and their middles;
  // at f = 1e-4 (modes start at k/aH ≈ 4000) the corners only, to keep the suite short.
  const bf = [[0.01, 1e-4], [0.9, 1e-4], [0.01, 0.03], [0.5, 0.03], [0.9, 0.03], [0.01, 10], [0.5, 10], [0.9, 10]];
  const corners = [50, 60].flatMap((nStar) => bf.map(([b, f]) => monodromyCase(b, f, nStar, 1e-10)));

  it.each(corners)('$label agrees with starts at k/aH ≥ 3000 and twice as deep as chosen', (c) => {
    expectAgreement(exact(c), exact(c, { startDepth: 3000, ...deeper(2) }));
  });

  it('the deepest corner is converged: starting 4 times deeper changes nothing beyond tolerance', () => {
    const c = monodromyCase(0.9, 1e-4, 60, 1e-10);
    expectAgreement(exact(c), exact(c, deeper(4)));
  });
});

describe('smooth potentials keep the start at k/aH = 30', () => {
  it.each([
    { label: 'φ²', potential: compile('phi^2', {}), phiInit: 16, nStar: 55 },
    { label: 'Starobinsky', potential: compile('0.75 * (1 - exp(-sqrt(2/3) * phi))^2', {}), phiInit: 5.8, nStar: 55 },
    monodromyCase(0.9, 10, 55),
  ])('$label: same result and the same number of evaluations as with no criterion', (c) => {
    const chosen = new PointEvaluator().evaluate({ potential: c.potential, phiInit: c.phiInit, nStar: c.nStar, method: 'exact' });
    const plain = new PointEvaluator(NO_CRITERION).evaluate({ potential: c.potential, phiInit: c.phiInit, nStar: c.nStar, method: 'exact' });
    if (chosen.status !== 'ok' || plain.status !== 'ok') throw new Error(`${c.label}: ${chosen.message || plain.message}`);
    expect(chosen.ns).toBe(plain.ns);
    expect(chosen.As).toBe(plain.As);
    expect(chosen.evaluations).toBe(plain.evaluations);
  });
});

describe('a pivot too close to the start for the depth required', () => {
  const message = /the modes need to start ([\d.]+) e-folds before the pivot \(k\/aH = ([\d.]+)\) but the background starts only ([\d.]+) e-folds before it; start further up the potential/;

  it('an oscillating background needs many e-folds before the pivot: pivot_too_early with both numbers', () => {
    // φ² from φ = 15.5 gives about 60.6 e-folds: 5.6 before the pivot, where k/aH ≈ 540 needs 6.5.
    const potential = compile('phi^2 * (1 + 1e-5 * sin(1e3 * phi))', {});
    const result = new PointEvaluator().evaluate({ potential, phiInit: 15.5, nStar: 55, method: 'exact' });
    expect(result.status).toBe('pivot_too_early');
    const [, needed, depth, available] = message.exec(result.message)!.map(Number);
    expect(depth).toBeGreaterThan(500);
    expect(available).toBeGreaterThan(5);
    expect(available).toBeLessThan(6);
    // The lowest stencil mode, ln k = −0.2, starts ln(depth) + 0.2 before the pivot (ε_H ≈ 0.01).
    expect(Math.abs(needed - (Math.log(depth) + 0.2))).toBeLessThan(0.1);
    expect(needed).toBeGreaterThan(available + 0.5);
    // Started further up, the same point has its history; its spectrum oscillates across the stencil, which is its own status.
    expect(new PointEvaluator().evaluate({ potential, phiInit: 16, nStar: 55, method: 'exact' }).status).toBe('spectrum_feature');
  });

  it('a smooth potential needs ln 30 ≈ 3.4 e-folds before the pivot', () => {
    // φ² from φ = 15.1 gives about 57 e-folds: 2 before the pivot.
    const result = new PointEvaluator().evaluate({ potential: compile('phi^2', {}), phiInit: 15.1, nStar: 55, method: 'exact' });
    expect(result.status).toBe('pivot_too_early');
    const [, needed, depth, available] = message.exec(result.message)!.map(Number);
    expect(depth).toBe(30);
    expect(available).toBeLessThan(3);
    expect(needed).toBeGreaterThan(3.4);
    expect(needed).toBeLessThan(3.8);
  });
});
