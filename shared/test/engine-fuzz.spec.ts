import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PointEvaluator, type PointOutcome } from '../src/engine/evaluate-point.js';
import { parsePotential, POTENTIAL_FUNCTIONS } from '../src/engine/expression/index.js';
import { SLOW_ROLL_REGIME } from '../src/engine/observables/slow-roll.js';
import { FAILURE_CODES } from '../src/engine/types.js';

/**
 * The engine fed generated potentials, starts and pivots: whatever the expression, it answers
 * with a known status and never throws; it never spends beyond its budget; an `ok` point has
 * finite observables in their physical ranges, and a slow-roll `ok` point lies inside the slow-roll
 * regime. `FUZZ_SEED=<n>` replays or varies a run (the default seed keeps CI repeatable).
 */

// shared is free of Node types, so the environment is read through globalThis.
const SEED = Number((globalThis as { process?: { env: Record<string, string | undefined> } }).process?.env.FUZZ_SEED ?? 20261204);
const BUDGET = { evaluations: 300_000, steps: 20_000 };

const constant = fc.oneof(
  fc.integer({ min: 1, max: 9 }).map(String),
  fc.double({ min: 1e-3, max: 50, noNaN: true }).map((x) => x.toPrecision(3)),
  fc.constantFrom('1e-5', '1e3', '0.5'),
);
const leaf = fc.oneof({ weight: 3, arbitrary: fc.constant('phi') }, { weight: 2, arbitrary: constant });
const { expression } = fc.letrec<{ expression: string }>((tie) => ({
  expression: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    leaf,
    fc.tuple(fc.constantFrom(...POTENTIAL_FUNCTIONS), tie('expression')).map(([f, x]) => `${f}(${x})`),
    fc.tuple(tie('expression'), fc.constantFrom('+', '-', '*', '/', '^'), tie('expression')).map(([a, op, b]) => `(${a} ${op} ${b})`),
  ),
}));
const pivot = fc.double({ min: 20, max: 80, noNaN: true });
const point = fc.oneof(
  // Anything the grammar builds, from anywhere: mostly refusals, which must be clean.
  { weight: 1, arbitrary: fc.record({ potential: expression, phiInit: fc.double({ min: -30, max: 30, noNaN: true }), nStar: pivot }) },
  // Built like the potentials people write: a known shape times a generated modulation, started where it may inflate.
  {
    weight: 3,
    arbitrary: fc.record({
      potential: fc
        .tuple(fc.constantFrom('phi^2', '(1 - exp(-phi))^2', 'phi', 'phi^4', 'tanh(phi/3)^2', '1 - cos(phi/5)'), fc.constantFrom('1e-2', '1e-3', '1e-5'), expression)
        .map(([shape, size, extra]) => `${shape} * (1 + ${size} * sin(${extra}))`),
      phiInit: fc.double({ min: 0.5, max: 25, noNaN: true }),
      nStar: pivot,
    }),
  },
);

function checkOutcome(outcome: PointOutcome, method: 'slowroll' | 'exact'): void {
  expect([...FAILURE_CODES, 'ok']).toContain(outcome.status);
  expect(typeof outcome.message).toBe('string');
  if (outcome.status !== 'ok') {
    expect(outcome.message.length).toBeGreaterThan(10);
    expect(outcome.message).not.toMatch(/\(ok\)/);
    return;
  }
  for (const value of [outcome.ns, outcome.r, outcome.alphaS, outcome.As, outcome.nTotal, outcome.phiStar, outcome.amplitudeScale]) {
    expect(Number.isFinite(value)).toBe(true);
  }
  expect(outcome.As).toBeGreaterThan(0);
  expect(outcome.r).toBeGreaterThanOrEqual(0);
  expect(outcome.nTotal).toBeGreaterThanOrEqual(outcome.nStar);
  expect(outcome.evaluations).toBeLessThanOrEqual(BUDGET.evaluations);
  if (outcome.trajectory) expect(outcome.trajectory.N.length).toBeLessThanOrEqual(BUDGET.steps);
  if (method === 'slowroll') {
    expect(outcome.epsilonV).toBeLessThanOrEqual(SLOW_ROLL_REGIME.epsilonV);
    expect(Math.abs(outcome.etaV)).toBeLessThanOrEqual(SLOW_ROLL_REGIME.etaV);
    expect(Math.abs(outcome.xi2V)).toBeLessThanOrEqual(SLOW_ROLL_REGIME.xi2V);
  }
}

describe('the engine on generated potentials', () => {
  const tally = new Map<string, number>();
  const run = (method: 'slowroll' | 'exact', numRuns: number) => {
    const engine = new PointEvaluator({}, { budget: BUDGET });
    fc.assert(
      fc.property(point, ({ potential, phiInit, nStar }) => {
        const parsed = parsePotential(potential, []);
        if (!parsed.ok) return; // the parser's refusals have their own tests
        const bound = parsed.potential.bind({});
        if (!bound.ok) return;
        let outcome: PointOutcome;
        try {
          outcome = engine.evaluate({ potential: bound.potential, phiInit, nStar, method, trajectory: true });
        } catch (error) {
          throw new Error(`the engine threw on V = ${potential}, φ_init = ${phiInit}, N_* = ${nStar}: ${(error as Error).message}`);
        }
        tally.set(`${method} ${outcome.status}`, (tally.get(`${method} ${outcome.status}`) ?? 0) + 1);
        checkOutcome(outcome, method);
      }),
      { seed: SEED, numRuns },
    );
  };

  it('slow roll: 300 points, every answer a known status inside its budget and regime', () => {
    run('slowroll', 300);
    // The generator reaches both answers and refusals, so the checks above are exercised.
    expect(tally.get('slowroll ok') ?? 0).toBeGreaterThan(20);
  }, 120_000);

  it('mode equations: 40 points, the same rules', () => {
    run('exact', 40);
    expect([...tally.keys()].some((key) => key.startsWith('exact'))).toBe(true);
  }, 120_000);
});
