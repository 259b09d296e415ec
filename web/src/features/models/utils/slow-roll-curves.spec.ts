import { parsePotential, type CompiledPotential } from '@sixtyfold/shared';
import { defaultPhiRange, slowRollCurves, slowRollEnd } from './slow-roll-curves';

function bind(expression: string, params: Record<string, number>): CompiledPotential {
  const parsed = parsePotential(expression, Object.keys(params));
  if (!parsed.ok) throw new Error(parsed.problem.message);
  const bound = parsed.potential.bind(params);
  if (!bound.ok) throw new Error(bound.problem.message);
  return bound.potential;
}

describe('slow-roll curves', () => {
  // For V = m²φ²/2: ε_V = η_V = 2/φ², so both are 1 at φ = √2.
  const quadratic = bind('0.5 * m^2 * phi^2', { m: 1e-5 });

  it('samples V, ε_V and |η_V| with their analytic values for a quadratic potential', () => {
    const curves = slowRollCurves(quadratic, 1, 3, 5);
    expect(curves.phi).toEqual([1, 1.5, 2, 2.5, 3]);
    expect(curves.V[2]).toBeCloseTo(0.5e-10 * 4, 20);
    curves.phi.forEach((phi, i) => {
      expect(curves.epsilonV[i]).toBeCloseTo(2 / phi ** 2, 12);
      expect(curves.absEtaV[i]).toBeCloseTo(2 / phi ** 2, 12);
    });
  });

  it('leaves ε_V and η_V out where V is not positive', () => {
    const hilltop = bind('V0 * (1 - phi^2 / mu^2)', { V0: 1e-10, mu: 1 });
    const curves = slowRollCurves(hilltop, 0.5, 1.5, 3);
    expect(curves.epsilonV[0]).not.toBeNull();
    expect(curves.epsilonV[1]).toBeNull(); // V(1) = 0
    expect(curves.epsilonV[2]).toBeNull();
    expect(curves.V[2]).toBeLessThan(0);
  });

  it('finds the end of slow roll, ε_V = 1 at φ = √2, from a start 60 e-folds up', () => {
    // Slow roll: N = (φ² − φ_end²)/4, so φ² = 4·60 + 2 starts 60 e-folds before the end.
    const { phiEnd, ended } = slowRollEnd(quadratic, Math.sqrt(242));
    expect(ended).toBe(true);
    expect(phiEnd).toBeGreaterThan(Math.SQRT2 - 0.05);
    expect(phiEnd).toBeLessThanOrEqual(Math.SQRT2);
  });

  it('gives up, saying so, where inflation never ends', () => {
    const exponential = bind('V0 * exp(-lambda * phi)', { V0: 1e-10, lambda: 0.1 });
    const { phiEnd, ended } = slowRollEnd(exponential, 0);
    expect(ended).toBe(false);
    expect(phiEnd).toBeCloseTo(0.1 * 2000, 5); // dφ/dN = λ for 2000 e-folds
  });

  it('frames the start and the end with a margin', () => {
    const range = defaultPhiRange(quadratic, Math.sqrt(242));
    expect(range.min).toBeLessThan(Math.SQRT2);
    expect(range.max).toBeGreaterThan(Math.sqrt(242));
    expect(range.max - range.min).toBeLessThan(1.5 * (Math.sqrt(242) - Math.SQRT2));
  });
});
