import { describe, expect, it } from 'vitest';
import { POTENTIAL_FAMILIES } from '../families/potential-families.js';
import { parsePotential } from './compile-potential.js';

function scaleOf(source: string, parameterNames: readonly string[]) {
  const result = parsePotential(source, parameterNames);
  if (!result.ok) throw new Error(`parse failed: ${result.problem.message}`);
  return result.potential.scale;
}

// Each expected answer is the closed form: the exponent k in V = c^k · g(φ, the rest).
describe('detectScale', () => {
  it.each([
    ['A*phi^2', ['A'], 'A', 1, 'V = A·φ²'],
    ['A^2*(1-exp(-sqrt(2/3)*phi))^2', ['A'], 'A', 2, 'V = A²·(1−e^{−√(2/3)φ})²'],
    ['phi^4 / A', ['A'], 'A', -1, 'V = A⁻¹·φ⁴'],
    ['phi^2 / (1/A)', ['A'], 'A', 1, 'V = A·φ²'],
    ['sqrt(A) * (1 + cos(phi))', ['A'], 'A', 0.5, 'V = A^½·(1+cos φ)'],
    ['A^(1/4) * phi^2', ['A'], 'A', 0.25, 'constant exponent 1/4'],
    ['A^(2*2) * phi^2', ['A'], 'A', 4, 'constant exponent 2·2 = 4'],
    ['-A * phi^2', ['A'], 'A', 1, 'V = A·(−φ²)'],
    ['(A*phi)^2', ['A'], 'A', 2, '(Aφ)² = A²·φ² for A > 0'],
    ['A * phi^2 * A', ['A'], 'A', 2, 'A·φ²·A = A²·φ²'],
    ['2 A phi^2', ['A'], 'A', 1, 'implicit product 2·A·φ²'],
    ['lambda * phi^p', ['lambda', 'p'], 'lambda', 1, 'p sits in the exponent of φ, λ multiplies'],
    ['A * B * phi^2', ['A', 'B'], 'A', 1, 'both scale V; the first declared is taken'],
    ['A * B * phi^2', ['B', 'A'], 'B', 1, 'both scale V; the first declared is taken'],
  ] as const)('%s (%j) → %s^%s (closed form: %s)', (source, names, parameter, power, _closedForm) => {
    expect(scaleOf(source, names)).toEqual({ parameter, power });
  });

  it.each([
    ['A*phi^2 + A', ['A'], 'V = A(φ² + 1) only after factoring; A appears in two terms of a sum'],
    ['A * phi^A', ['A'], 'A is also the exponent of φ'],
    ['exp(A) * phi^2', ['A'], 'e^A is not a power of A'],
    ['A / A * phi^2', ['A'], 'A⁰: V does not depend on A'],
    ['(A*phi)^B', ['A', 'B'], 'the exponent B is not a number, so (Aφ)^B is not A^k·g'],
    ['abs(A) * phi^2', ['A'], '|A| is not a bare factor'],
    ['0.5*m^2*phi^2 + lambda4/4*phi^4', ['m', 'lambda4'], 'a sum whose terms have different parameters'],
    ['phi^2', ['A'], 'A is declared but unused: V ∝ A⁰'],
    ['A*phi^2 / (1 + A*phi^2)', ['A'], 'A also sits in the denominator'],
    ['sqrt(A*phi^2 + 1) * A', ['A'], 'A also sits in a sum under the root'],
  ] as const)('%s (%j) has no scale parameter (closed form: %s)', (source, names, _closedForm) => {
    expect(scaleOf(source, names)).toBeUndefined();
  });

  it('finds in every built-in family the scale it declares', () => {
    for (const family of POTENTIAL_FAMILIES) {
      expect({ key: family.key, scale: scaleOf(family.expression, family.parameters.map((p) => p.name)) }).toEqual({ key: family.key, scale: family.scale });
    }
  });
});
