import { describe, expect, it } from 'vitest';
import { MAX_POTENTIAL_LENGTH, parsePotential, type CompiledPotential, type ParsedPotential } from './compile-potential.js';
import { POTENTIAL_FUNCTIONS } from './expression-tree.js';

function parsed(source: string, parameterNames: readonly string[]): ParsedPotential {
  const result = parsePotential(source, parameterNames);
  if (!result.ok) throw new Error(`parse failed: ${result.problem.message}`);
  return result.potential;
}

function bound(source: string, params: Record<string, number>): CompiledPotential {
  const result = parsed(source, Object.keys(params)).bind(params);
  if (!result.ok) throw new Error(`bind failed: ${result.problem.message}`);
  return result.potential;
}

function problemOf(source: string, parameterNames: readonly string[] = []) {
  const result = parsePotential(source, parameterNames);
  if (result.ok) throw new Error(`expected a problem for ${JSON.stringify(source)}`);
  return result.problem;
}

function expectRelative(actual: number, expected: number, tolerance: number, label: string): void {
  const error = Math.abs(actual - expected);
  const allowed = tolerance * Math.abs(expected);
  if (!(error <= allowed)) {
    throw new Error(`${label}: got ${actual}, expected ${expected} (relative error ${error / Math.abs(expected)})`);
  }
}

// 8th-order central difference for a first derivative (Fornberg's coefficients); truncation error
// O(h^8), so at h ~ 1e-2 of the function's scale it is limited by rounding, about 1e-13 relative.
const FD_WEIGHTS = [4 / 5, -1 / 5, 4 / 105, -1 / 280];
function centralDifference(f: (x: number) => number, x: number, h: number): number {
  let sum = 0;
  for (let k = 1; k <= FD_WEIGHTS.length; k++) sum += FD_WEIGHTS[k - 1] * (f(x + k * h) - f(x - k * h));
  return sum / h;
}

type Params = Record<string, number>;
interface AnalyticCase {
  name: string;
  source: string;
  params: Params;
  /** Points chosen away from zeros of V and its derivatives, so relative error is meaningful. */
  points: number[];
  /** Finite-difference step at phi: about 1e-2 of the scale on which V varies there. */
  step: (phi: number, p: Params) => number;
  V: (phi: number, p: Params) => number;
  dV: (phi: number, p: Params) => number;
  d2V: (phi: number, p: Params) => number;
  d3V: (phi: number, p: Params) => number;
}

const starobinskyK = (p: Params) => Math.sqrt(2 / (3 * p.alpha));
const tModelT = (phi: number, p: Params) => Math.tanh(phi / Math.sqrt(6 * p.alpha));
const tModelS2 = (phi: number, p: Params) => 1 / Math.cosh(phi / Math.sqrt(6 * p.alpha)) ** 2;

// Hand-derived forms. Starobinsky with E = exp(-k phi): V' = 2 V0 k E (1 - E),
// V'' = 2 V0 k^2 E (2E - 1), V''' = 2 V0 k^3 E (1 - 4E). T-model with t = tanh(phi/M), s2 = sech^2,
// M = sqrt(6 alpha): V' = 2 V0 t s2 / M, V'' = 2 V0 s2 (1 - 3t^2) / M^2, V''' = -8 V0 t s2 (2 - 3t^2) / M^3.
// Log-corrected quadratic: V' = m^2 phi (1 + c log phi^2 + c), V'' = m^2 (1 + c log phi^2 + 3c), V''' = 2 m^2 c / phi.
const CASES: AnalyticCase[] = [
  {
    name: 'monomial lambda phi^p, p = 2/3',
    source: 'lambda * phi^p',
    params: { lambda: 3.2e-10, p: 2 / 3 },
    points: [0.05, 0.5, 1, 3.7, 15],
    step: (phi) => 1e-2 * phi,
    V: (phi, { lambda, p }) => lambda * phi ** p,
    dV: (phi, { lambda, p }) => lambda * p * phi ** (p - 1),
    d2V: (phi, { lambda, p }) => lambda * p * (p - 1) * phi ** (p - 2),
    d3V: (phi, { lambda, p }) => lambda * p * (p - 1) * (p - 2) * phi ** (p - 3),
  },
  {
    name: 'monomial lambda phi^p, p = 3.5',
    source: 'lambda * phi^p',
    params: { lambda: 0.7, p: 3.5 },
    points: [0.2, 1, 9],
    step: (phi) => 1e-2 * phi,
    V: (phi, { lambda, p }) => lambda * phi ** p,
    dV: (phi, { lambda, p }) => lambda * p * phi ** (p - 1),
    d2V: (phi, { lambda, p }) => lambda * p * (p - 1) * phi ** (p - 2),
    d3V: (phi, { lambda, p }) => lambda * p * (p - 1) * (p - 2) * phi ** (p - 3),
  },
  {
    name: 'Starobinsky plateau',
    source: 'V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2',
    params: { V0: 1.1e-10, alpha: 1 },
    points: [-0.6, 0.3, 1.7, 5.5, 10],
    step: () => 1e-2,
    V: (phi, p) => p.V0 * (1 - Math.exp(-starobinskyK(p) * phi)) ** 2,
    dV: (phi, p) => {
      const k = starobinskyK(p);
      const E = Math.exp(-k * phi);
      return 2 * p.V0 * k * E * (1 - E);
    },
    d2V: (phi, p) => {
      const k = starobinskyK(p);
      const E = Math.exp(-k * phi);
      return 2 * p.V0 * k ** 2 * E * (2 * E - 1);
    },
    d3V: (phi, p) => {
      const k = starobinskyK(p);
      const E = Math.exp(-k * phi);
      return 2 * p.V0 * k ** 3 * E * (1 - 4 * E);
    },
  },
  {
    name: 'Starobinsky plateau, alpha = 7.3',
    source: 'V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2',
    params: { V0: 2, alpha: 7.3 },
    points: [0.4, 4, 20],
    step: () => 1e-2,
    V: (phi, p) => p.V0 * (1 - Math.exp(-starobinskyK(p) * phi)) ** 2,
    dV: (phi, p) => 2 * p.V0 * starobinskyK(p) * Math.exp(-starobinskyK(p) * phi) * (1 - Math.exp(-starobinskyK(p) * phi)),
    d2V: (phi, p) => {
      const E = Math.exp(-starobinskyK(p) * phi);
      return 2 * p.V0 * starobinskyK(p) ** 2 * E * (2 * E - 1);
    },
    d3V: (phi, p) => {
      const E = Math.exp(-starobinskyK(p) * phi);
      return 2 * p.V0 * starobinskyK(p) ** 3 * E * (1 - 4 * E);
    },
  },
  {
    name: 'natural inflation',
    source: 'Lambda^4 * (1 + cos(phi / f))',
    params: { Lambda: 1e-3, f: 5 },
    points: [2, 6.5, 11, 20, -3],
    step: (_, { f }) => 1e-2 * f,
    V: (phi, { Lambda, f }) => Lambda ** 4 * (1 + Math.cos(phi / f)),
    dV: (phi, { Lambda, f }) => (-(Lambda ** 4) * Math.sin(phi / f)) / f,
    d2V: (phi, { Lambda, f }) => (-(Lambda ** 4) * Math.cos(phi / f)) / f ** 2,
    d3V: (phi, { Lambda, f }) => (Lambda ** 4 * Math.sin(phi / f)) / f ** 3,
  },
  {
    name: 'tanh T-model',
    source: 'V0 * tanh(phi / sqrt(6 * alpha))^2',
    params: { V0: 4e-11, alpha: 1 },
    points: [0.5, 2.4, 6, -1.2],
    step: () => 1e-2,
    V: (phi, p) => p.V0 * tModelT(phi, p) ** 2,
    dV: (phi, p) => (2 * p.V0 * tModelT(phi, p) * tModelS2(phi, p)) / Math.sqrt(6 * p.alpha),
    d2V: (phi, p) => (2 * p.V0 * tModelS2(phi, p) * (1 - 3 * tModelT(phi, p) ** 2)) / (6 * p.alpha),
    d3V: (phi, p) => {
      const t = tModelT(phi, p);
      return (-8 * p.V0 * t * tModelS2(phi, p) * (2 - 3 * t ** 2)) / Math.sqrt(6 * p.alpha) ** 3;
    },
  },
  {
    name: 'quadratic with a log correction',
    source: '0.5*m^2*phi^2*(1 + c*log(phi^2))',
    params: { m: 6e-6, c: 0.013 },
    points: [0.3, 2, 11, -2],
    step: (phi) => 1e-2 * Math.abs(phi),
    V: (phi, { m, c }) => 0.5 * m ** 2 * phi ** 2 * (1 + c * Math.log(phi ** 2)),
    dV: (phi, { m, c }) => m ** 2 * phi * (1 + c * Math.log(phi ** 2) + c),
    d2V: (phi, { m, c }) => m ** 2 * (1 + c * Math.log(phi ** 2) + 3 * c),
    d3V: (phi, { m, c }) => (2 * m ** 2 * c) / phi,
  },
];

describe('parsePotential: values and derivatives', () => {
  for (const c of CASES) {
    it(`${c.name}: V, V', V'', V''' match the hand-derived forms to 1e-12`, () => {
      const potential = bound(c.source, c.params);
      for (const phi of c.points) {
        expectRelative(potential.V(phi), c.V(phi, c.params), 1e-12, `V(${phi})`);
        expectRelative(potential.dV(phi), c.dV(phi, c.params), 1e-12, `dV(${phi})`);
        expectRelative(potential.d2V(phi), c.d2V(phi, c.params), 1e-12, `d2V(${phi})`);
        expectRelative(potential.d3V(phi), c.d3V(phi, c.params), 1e-12, `d3V(${phi})`);
      }
    });

    it(`${c.name}: each derivative matches an 8th-order finite difference of the one below`, () => {
      const potential = bound(c.source, c.params);
      for (const phi of c.points) {
        const h = c.step(phi, c.params);
        expectRelative(centralDifference(potential.V, phi, h), potential.dV(phi), 1e-8, `FD V'(${phi})`);
        expectRelative(centralDifference(potential.dV, phi, h), potential.d2V(phi), 1e-8, `FD V''(${phi})`);
        expectRelative(centralDifference(potential.d2V, phi, h), potential.d3V(phi), 1e-8, `FD V'''(${phi})`);
      }
    });
  }

  it('the finite-difference check would catch a wrong derivative', () => {
    // Guards the check above: a 1e-6 relative error in V' must not pass at 1e-8.
    const potential = bound('lambda * phi^p', { lambda: 1, p: 2 / 3 });
    const wrong = (phi: number) => potential.dV(phi) * (1 + 1e-6);
    expect(() => expectRelative(centralDifference(potential.V, 1, 1e-2), wrong(1), 1e-8, 'wrong')).toThrow();
  });

  it('the Starobinsky derivatives are right at its minimum phi = 0', () => {
    const p = { V0: 1.1e-10, alpha: 1 };
    const potential = bound('V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2', p);
    const k = starobinskyK(p);
    expect(potential.V(0)).toBe(0);
    expect(potential.dV(0)).toBe(0);
    expectRelative(potential.d2V(0), 2 * p.V0 * k ** 2, 1e-12, "V''(0)");
    expectRelative(potential.d3V(0), -6 * p.V0 * k ** 3, 1e-12, "V'''(0)");
  });

  it('log(x, base) with two arguments is the logarithm to that base', () => {
    const potential = bound('A * log(phi, b)', { A: 3, b: 7 });
    for (const phi of [0.5, 2, 40]) {
      const lnb = Math.log(7);
      expectRelative(potential.V(phi), (3 * Math.log(phi)) / lnb, 1e-12, 'V');
      expectRelative(potential.dV(phi), 3 / (phi * lnb), 1e-12, 'dV');
      expectRelative(potential.d2V(phi), -3 / (phi ** 2 * lnb), 1e-12, 'd2V');
      expectRelative(potential.d3V(phi), 6 / (phi ** 3 * lnb), 1e-12, 'd3V');
    }
  });

  it('knows pi and e, and implicit multiplication such as 2phi', () => {
    const potential = bound('2phi^2 * pi + e * phi', {});
    expectRelative(potential.V(1.5), 2 * 1.5 ** 2 * Math.PI + Math.E * 1.5, 1e-15, 'V');
    expectRelative(potential.dV(1.5), 4 * 1.5 * Math.PI + Math.E, 1e-15, 'dV');
    expectRelative(potential.d2V(1.5), 4 * Math.PI, 1e-15, 'd2V');
    expect(potential.d3V(1.5)).toBe(0);
  });

  // Each whitelisted function, inside a chain rule so mathjs's derivative rule for it is exercised;
  // the argument stays inside every function's real domain.
  const ARGUMENTS: Record<string, number[]> = {
    asin: [-0.5, 0.3],
    acos: [-0.5, 0.3],
    atanh: [-0.5, 0.3],
    acosh: [1.4, 3],
    log: [0.4, 3],
    log10: [0.4, 3],
    sqrt: [0.4, 3],
    abs: [-0.5, 0.3],
  };
  for (const fn of POTENTIAL_FUNCTIONS) {
    it(`${fn}: V is Math's ${fn} and all three derivatives match finite differences`, () => {
      const potential = bound(`${fn}(a * phi + b)`, { a: 0.8, b: 0.1 });
      const reference: Record<string, (x: number) => number> = {
        sec: (x) => 1 / Math.cos(x),
        csc: (x) => 1 / Math.sin(x),
        cot: (x) => 1 / Math.tan(x),
        sech: (x) => 1 / Math.cosh(x),
        csch: (x) => 1 / Math.sinh(x),
        coth: (x) => 1 / Math.tanh(x),
      };
      const f = reference[fn] ?? (Math[fn as keyof Math] as (x: number) => number);
      for (const x of ARGUMENTS[fn] ?? [0.45, 1.2]) {
        const phi = (x - 0.1) / 0.8;
        expect(potential.V(phi)).toBe(f(0.8 * phi + 0.1));
        const h = 1e-3;
        if (fn === 'abs') {
          // |u|'' is zero away from u = 0; the compiled form may leave rounding noise.
          expect(potential.dV(phi)).toBeCloseTo(0.8 * Math.sign(x), 15);
          expect(Math.abs(potential.d2V(phi))).toBeLessThan(1e-14);
          expect(Math.abs(potential.d3V(phi))).toBeLessThan(1e-14);
          continue;
        }
        expectRelative(centralDifference(potential.V, phi, h), potential.dV(phi), 1e-7, `${fn} V'`);
        expectRelative(centralDifference(potential.dV, phi, h), potential.d2V(phi), 1e-7, `${fn} V''`);
        expectRelative(centralDifference(potential.d2V, phi, h), potential.d3V(phi), 1e-7, `${fn} V'''`);
      }
    });
  }

  it('integer powers 2, 3, 4 agree with Math.pow, also for negative bases and bound exponents', () => {
    for (const n of [2, 3, 4]) {
      const literal = bound(`phi^${n}`, {});
      const viaParameter = bound('phi^n', { n });
      for (const phi of [-2.5, -0.3, 0, 0.7, 1e70, 3]) {
        expectRelative(literal.V(phi), Math.pow(phi, n), 4e-16, `phi^${n} at ${phi}`);
        expectRelative(viaParameter.V(phi), Math.pow(phi, n), 4e-16, `phi^n, n=${n} at ${phi}`);
      }
    }
    expect(bound('phi^0.5', {}).V(-1)).toBeNaN();
    expect(bound('phi^(-2)', {}).V(0.5)).toBe(4);
  });

  it('a coefficient that folds to zero at bind time removes the term, also at phi = 0', () => {
    // d3V = lambda p (p-1) (p-2) phi^(p-3): for p = 2 this is 0 * Infinity at phi = 0 unless folded.
    const quadratic = bound('lambda * phi^p', { lambda: 3, p: 2 });
    expect(quadratic.V(0)).toBe(0);
    expect(quadratic.dV(0)).toBe(0);
    expect(quadratic.d2V(0)).toBe(6);
    expect(quadratic.d3V(0)).toBe(0);
    const corrected = bound('0.5*m^2*phi^2*(1 + c*log(phi^2))', { m: 1, c: 0 });
    expect(corrected.V(0)).toBe(0);
    expect(corrected.d2V(0)).toBe(1);
  });

  it('compiled functions work detached from their object, as integrators call them', () => {
    const { V, dV } = bound('lambda * phi^4', { lambda: 2 });
    expect(V(3)).toBe(162);
    expect(dV(3)).toBe(216);
  });

  it('handles parameter values from 1e-12 to 1e12', () => {
    for (const lambda of [1e-12, 1e12]) {
      const potential = bound('lambda * phi^p', { lambda, p: 1.3 });
      expectRelative(potential.V(2), lambda * 2 ** 1.3, 1e-12, `V, lambda=${lambda}`);
      expectRelative(potential.d3V(2), lambda * 1.3 * 0.3 * -0.7 * 2 ** -1.7, 1e-12, `d3V, lambda=${lambda}`);
    }
    for (const f of [1e-12, 1e12]) {
      const p = { Lambda: 1e-3, f };
      const potential = bound('Lambda^4 * (1 + cos(phi / f))', p);
      const phi = 0.9 * f;
      expectRelative(potential.V(phi), 1e-12 * (1 + Math.cos(0.9)), 1e-12, `V, f=${f}`);
      expectRelative(potential.d2V(phi), (-1e-12 * Math.cos(0.9)) / f ** 2, 1e-12, `d2V, f=${f}`);
      expectRelative(potential.d3V(phi), (1e-12 * Math.sin(0.9)) / f ** 3, 1e-12, `d3V, f=${f}`);
    }
    for (const V0 of [1e-12, 1e12]) {
      const p = { V0, alpha: 1e-12 };
      const potential = bound('V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2', p);
      const k = starobinskyK(p);
      const phi = 1.3 / k;
      const E = Math.exp(-1.3);
      expectRelative(potential.V(phi), V0 * (1 - E) ** 2, 1e-12, `V, V0=${V0}`);
      expectRelative(potential.dV(phi), 2 * V0 * k * E * (1 - E), 1e-12, `dV, V0=${V0}`);
      expectRelative(potential.d3V(phi), 2 * V0 * k ** 3 * E * (1 - 4 * E), 1e-12, `d3V, V0=${V0}`);
    }
  });

  it('the same source and values always give the same numbers', () => {
    const a = bound('V0 * tanh(phi / sqrt(6 * alpha))^2', { V0: 1, alpha: 2 });
    const b = bound('V0 * tanh(phi / sqrt(6 * alpha))^2', { V0: 1, alpha: 2 });
    for (const phi of [0.1, 1, 5]) {
      expect(a.d3V(phi)).toBe(b.d3V(phi));
      expect(a.V(phi)).toBe(b.V(phi));
    }
  });
});

describe('parsePotential: derivative text and metadata', () => {
  it('gives the simplified derivatives of a monomial as text', () => {
    const potential = parsed('lambda * phi^p', ['lambda', 'p']);
    expect(potential.derivatives).toEqual({
      dV: 'lambda * p * phi ^ (p - 1)',
      d2V: 'lambda * p * (p - 1) * phi ^ (p - 2)',
      d3V: 'lambda * p * (p - 1) * (p - 2) * phi ^ (p - 3)',
    });
  });

  for (const c of CASES) {
    it(`${c.name}: each derivative text, parsed back, evaluates to the compiled derivative`, () => {
      const potential = parsed(c.source, Object.keys(c.params));
      const compiled = bound(c.source, c.params);
      for (const key of ['dV', 'd2V', 'd3V'] as const) {
        const fromText = bound(potential.derivatives[key], c.params);
        for (const phi of c.points) expectRelative(fromText.V(phi), compiled[key](phi), 1e-12, `${key} text at ${phi}`);
      }
      expect(compiled.derivatives).toEqual(potential.derivatives);
    });
  }

  it('reports the parameters actually used, in declaration order', () => {
    const potential = parsed('b * phi^2 + a', ['a', 'unused', 'b']);
    expect(potential.parameterNames).toEqual(['a', 'b']);
    expect(potential.declaredParameterNames).toEqual(['a', 'unused', 'b']);
    expect(potential.source).toBe('b * phi^2 + a');
    const result = potential.bind({ a: 1, unused: 5, b: 2 });
    expect(result.ok && result.potential.parameterNames).toEqual(['a', 'b']);
  });

  it('accepts a trailing line break, semicolon or comment', () => {
    for (const source of ['phi^2\n', 'phi^2;', 'phi^2 # quadratic']) {
      expect(bound(source, {}).V(3)).toBe(9);
    }
  });
});

describe('bind: parameter values', () => {
  const potential = parsed('lambda * phi^p', ['lambda', 'p']);

  it('refuses a missing parameter', () => {
    expect(potential.bind({ lambda: 1 })).toEqual({ ok: false, problem: { message: "Parameter 'p' has no value" } });
  });

  it.each([NaN, Infinity, -Infinity])('refuses the value %s', (value) => {
    const result = potential.bind({ lambda: value, p: 2 });
    expect(result).toEqual({ ok: false, problem: { message: `Parameter 'lambda' must be a finite number, not ${value}` } });
  });

  it('refuses a value that is not a number at all', () => {
    const result = potential.bind({ lambda: '2' as unknown as number, p: 2 });
    expect(result.ok).toBe(false);
    expect(!result.ok && result.problem.message).toBe("Parameter 'lambda' must be a finite number, not 2");
  });

  it('refuses a name the potential does not declare', () => {
    const result = potential.bind({ lambda: 1, p: 2, lamda: 3 });
    expect(result).toEqual({
      ok: false,
      problem: { message: "'lamda' is not a parameter of this potential (parameters: lambda, p)" },
    });
  });

  it('does not take an inherited property as a value', () => {
    const toStringModel = parsed('toString * phi', ['toString']);
    expect(toStringModel.bind({}).ok).toBe(false);
    const ok = toStringModel.bind({ toString: 3 });
    expect(ok.ok && ok.potential.V(2)).toBe(6);
  });

  it('binds different values independently', () => {
    const one = potential.bind({ lambda: 1, p: 2 });
    const two = potential.bind({ lambda: 2, p: 3 });
    if (!one.ok || !two.ok) throw new Error('bind failed');
    expect(one.potential.V(2)).toBe(4);
    expect(two.potential.V(2)).toBe(16);
    expect(one.potential.dV(2)).toBe(4);
  });
});

describe('parsePotential: problems', () => {
  it('syntax error: index from mathjs "(char N)", 0-based', () => {
    expect(problemOf('phi @ 2')).toEqual({ message: 'Syntax error at character 5: unexpected "@ 2"', index: 4, length: 3 });
    expect(problemOf('phi^^2')).toEqual({ message: 'Syntax error at character 5: value expected', index: 4, length: 1 });
  });

  it('syntax error at the end of the text', () => {
    expect(problemOf('2 * (phi + 1')).toEqual({
      message: 'Syntax error at the end of the expression: parenthesis ) expected',
      index: 12,
      length: 0,
    });
  });

  it('unknown symbol, located as a whole word and with a suggestion', () => {
    expect(problemOf('2*lamda * phi^p', ['lambda', 'p'])).toEqual({
      message: "Unknown symbol 'lamda' at character 3: use phi or one of the parameters lambda, p (did you mean 'lambda'?)",
      index: 2,
      length: 5,
    });
    // 'a' also occurs inside 'alpha' and 'phi'; only the standalone one counts.
    expect(problemOf('alpha*phi + a', ['alpha'])).toEqual({
      message: "Unknown symbol 'a' at character 13: use phi or one of the parameters alpha",
      index: 12,
      length: 1,
    });
    expect(problemOf('x^2')).toEqual({
      message: "Unknown symbol 'x' at character 1: use phi (this potential has no parameters)",
      index: 0,
      length: 1,
    });
  });

  it('a function name used as a symbol', () => {
    expect(problemOf('phi * sqrt')).toEqual({
      message: "Unknown symbol 'sqrt' at character 7: sqrt is a function, write sqrt(...)",
      index: 6,
      length: 4,
    });
  });

  it('unknown or unsupported function, with the allowed list', () => {
    const problem = problemOf('V0 * floor(phi)', ['V0']);
    expect(problem).toEqual({
      message: `Unsupported function 'floor' at character 6: use one of ${POTENTIAL_FUNCTIONS.join(', ')}`,
      index: 5,
      length: 5,
    });
    expect(problem.message).toContain('sqrt, exp, log, log10');
    expect(problemOf('phi + erf(phi) * 2')).toMatchObject({ index: 6, length: 3 });
  });

  it('a parameter called like a function', () => {
    expect(problemOf('lambda(phi + 1)', ['lambda'])).toEqual({
      message: "'lambda' at character 1 is not a function: write lambda * (...) for a product",
      index: 0,
      length: 6,
    });
  });

  it('a name used both bare and called is located at the use that is wrong', () => {
    // 'lambda' first occurs as a valid symbol; the call at character 15 is the problem.
    expect(problemOf('lambda * phi + lambda(phi)', ['lambda'])).toMatchObject({ index: 15, length: 6 });
    // 'sqrt' first occurs as a valid call; the bare symbol at character 13 is the problem.
    expect(problemOf('sqrt(phi) + sqrt')).toMatchObject({ index: 12, length: 4 });
  });

  it('wrong number of arguments', () => {
    expect(problemOf('phi + sin(phi, 2)')).toEqual({
      message: "Function 'sin' at character 7 takes 1 argument, not 2",
      index: 6,
      length: 3,
    });
    expect(problemOf('log(phi, 2, 3)')).toMatchObject({ message: expect.stringContaining('takes 1 or 2 arguments'), index: 0 });
    expect(problemOf('phi + exp()')).toMatchObject({ message: expect.stringContaining('not 0'), index: 6 });
  });

  it.each([
    ['a = phi', 2, 'assignment (=)'],
    ['f(x) = phi', 5, 'defining a function'],
    ['[phi, 1]', 0, 'matrices and vectors'],
    ['1:phi', 1, 'ranges'],
    ['"phi"', 0, 'Text in quotes'],
    ['phi > 1 ? phi : 1', 8, 'conditionals'],
    ['phi >= 1', 4, 'comparisons'],
    ['phi == 1', 4, 'comparisons'],
    ['0 < phi < 1', 2, 'comparisons'],
    ['phi!', 3, 'factorial (!)'],
    ['phi mod 2', 4, 'modulo'],
    ['phi % 2', 4, 'modulo'],
    ['phi and 1', 4, 'logical operators'],
    ['phi & 1', 4, 'bitwise operators'],
    ['phi .* 2', 4, 'element-wise operators'],
    ["phi'", 3, 'transpose'],
    ['phi to cm', 4, 'unit conversion'],
    ['{a: phi}', 0, 'objects'],
    ['phi[1]', 3, 'property and index access'],
    ['phi.x', 3, 'property and index access'],
    ['phi\n2', 3, 'several expressions'],
    ['phi; 2', 3, 'several expressions'],
    ['true * phi', 0, "'true'"],
    ['NaN * phi', 0, 'not finite'],
    ['1e999 * phi', 0, 'not finite'],
  ])('unsupported syntax %j at index %i: %s', (source, index, words) => {
    const problem = problemOf(source, ['a']);
    expect(problem.message).toContain(words);
    expect(problem.message).toContain(`at character ${index + 1}`);
    expect(problem.index).toBe(index);
  });

  it('not a function of phi', () => {
    expect(problemOf('lambda * 2', ['lambda'])).toEqual({
      message: 'The expression does not depend on phi: V must be a function of the field phi',
    });
  });

  it.each(['', '   ', '# just a comment'])('empty expression %j', (source) => {
    expect(problemOf(source)).toEqual({ message: 'The expression is empty: write V in terms of phi, e.g. lambda * phi^4' });
  });

  it(`too long: more than ${MAX_POTENTIAL_LENGTH} characters`, () => {
    const source = `phi${' + phi'.repeat(400)}`;
    expect(source.length).toBeGreaterThan(MAX_POTENTIAL_LENGTH);
    expect(problemOf(source)).toEqual({
      message: `The expression is ${source.length} characters long; the limit is ${MAX_POTENTIAL_LENGTH}`,
      index: MAX_POTENTIAL_LENGTH,
      length: source.length - MAX_POTENTIAL_LENGTH,
    });
    const justFits = `phi${' + 1'.repeat((MAX_POTENTIAL_LENGTH - 3) / 4)}`.padEnd(MAX_POTENTIAL_LENGTH, ' ');
    expect(justFits.length).toBe(MAX_POTENTIAL_LENGTH);
    expect(parsePotential(justFits, []).ok).toBe(true);
  });

  it('nesting too deep for the parser', () => {
    expect(problemOf(`${'('.repeat(990)}phi${')'.repeat(990)}`)).toEqual({ message: 'The expression is nested too deeply to be read' });
  });

  it('derivatives that grow too large', () => {
    const problem = problemOf(`${'sin('.repeat(60)}phi${')'.repeat(60)}`);
    expect(problem.message).toMatch(/^The expression is too complex: its second derivative has \d+ parts \(at most 10000\)/);
  });

  it.each([
    [['2a'], "Parameter name '2a' is not allowed"],
    [['e'], "Parameter name 'e' is reserved"],
    [['phi'], "Parameter name 'phi' is reserved"],
    [['exp'], "Parameter name 'exp' is reserved"],
    [['mod'], "Parameter name 'mod' is reserved"],
    [['a', 'a'], "Parameter 'a' is declared twice"],
  ])('bad parameter names %j', (names, message) => {
    expect(problemOf('phi', names).message).toContain(message);
  });
});
