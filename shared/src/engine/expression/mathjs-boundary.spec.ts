import type { MathNode } from 'mathjs/number';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { parsePotential, type ParsedPotential } from './compile-potential.js';
import { math } from './mathjs-instance.js';

// Every mathjs call goes through these spies, so a test can count calls, make them fail, or get
// hold of the nodes mathjs produced. Unless a test says otherwise they run the real functions.
vi.mock('./mathjs-instance.js', async (importOriginal) => {
  const actual = await importOriginal<typeof import('./mathjs-instance.js')>();
  return {
    math: {
      parse: vi.fn(actual.math.parse),
      derivative: vi.fn(actual.math.derivative),
      simplify: vi.fn(actual.math.simplify),
    },
  };
});

const parse = vi.mocked(math.parse);
const derivative = vi.mocked(math.derivative);
const simplify = vi.mocked(math.simplify);

afterEach(() => {
  // Back to the real implementations and zero counts.
  parse.mockReset();
  derivative.mockReset();
  simplify.mockReset();
});

function parsed(source: string, names: readonly string[]): ParsedPotential {
  const result = parsePotential(source, names);
  if (!result.ok) throw new Error(result.problem.message);
  return result.potential;
}

function allNodes(roots: MathNode[]): MathNode[] {
  const nodes: MathNode[] = [];
  for (const root of roots) root.traverse((node) => nodes.push(node));
  return nodes;
}

const STAROBINSKY = 'V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2';
const starobinsky = (phi: number) => {
  const k = Math.sqrt(2 / 3);
  const E = Math.exp(-k * phi);
  return { V: (1 - E) ** 2, dV: 2 * k * E * (1 - E), d2V: 2 * k ** 2 * E * (2 * E - 1), d3V: 2 * k ** 3 * E * (1 - 4 * E) };
};

describe('mathjs is used at parse time only', () => {
  it('bind() and evaluation call no mathjs function, even when all of them throw', () => {
    const potential = parsed(STAROBINSKY, ['V0', 'alpha']);
    const calls = parse.mock.calls.length + derivative.mock.calls.length + simplify.mock.calls.length;
    expect(calls).toBeGreaterThan(0);
    const refuse = () => {
      throw new Error('mathjs called after parsePotential');
    };
    parse.mockImplementation(refuse);
    derivative.mockImplementation(refuse);
    simplify.mockImplementation(refuse);

    const result = potential.bind({ V0: 1, alpha: 1 });
    if (!result.ok) throw new Error(result.problem.message);
    const { V, dV, d2V, d3V } = result.potential;
    for (const phi of [0.3, 2, 7]) {
      const want = starobinsky(phi);
      expect(V(phi)).toBeCloseTo(want.V, 14);
      expect(dV(phi)).toBeCloseTo(want.dV, 14);
      expect(d2V(phi)).toBeCloseTo(want.d2V, 14);
      expect(d3V(phi)).toBeCloseTo(want.d3V, 14);
    }
    expect(parse.mock.calls.length + derivative.mock.calls.length + simplify.mock.calls.length).toBe(calls);
  });

  it('results do not change when every mathjs node from parsing is wrecked afterwards', () => {
    const potential = parsed(STAROBINSKY, ['V0', 'alpha']);
    const first = potential.bind({ V0: 1, alpha: 1 });
    if (!first.ok) throw new Error(first.problem.message);
    const before = [0.3, 2, 7].map((phi) => [first.potential.V(phi), first.potential.d3V(phi)]);

    const produced = [...parse.mock.results, ...derivative.mock.results, ...simplify.mock.results]
      .filter((r) => r.type === 'return')
      .map((r) => r.value as MathNode);
    const nodes = allNodes(produced);
    expect(nodes.length).toBeGreaterThan(50);
    for (const node of nodes) {
      const fields = node as unknown as Record<string, unknown>;
      for (const key of Object.keys(fields)) fields[key] = key === 'value' ? NaN : undefined;
    }

    const second = potential.bind({ V0: 1, alpha: 1 });
    if (!second.ok) throw new Error(second.problem.message);
    const after = [0.3, 2, 7].map((phi) => [second.potential.V(phi), second.potential.d3V(phi)]);
    expect(after).toEqual(before);
    expect([0.3, 2, 7].map((phi) => [first.potential.V(phi), first.potential.d3V(phi)])).toEqual(before);
  });
});

describe('when simplify fails or misleads', () => {
  it('keeps the unsimplified derivative when simplify throws', () => {
    simplify.mockImplementation(() => {
      throw new Error('simplify broke');
    });
    const potential = parsed('lambda * phi^p', ['lambda', 'p']);
    expect(potential.derivatives.dV).toBe('lambda * p * 1 * phi ^ (p - 1)');
    const result = potential.bind({ lambda: 2, p: 2.5 });
    if (!result.ok) throw new Error(result.problem.message);
    expect(result.potential.dV(3)).toBeCloseTo(2 * 2.5 * 3 ** 1.5, 12);
    expect(result.potential.d3V(3)).toBeCloseTo(2 * 2.5 * 1.5 * 0.5 * 3 ** -0.5, 12);
  });

  it('unsimplified derivatives are still right where the power rule leaves 0 * f^(-1) terms', () => {
    simplify.mockImplementation(() => {
      throw new Error('simplify broke');
    });
    const plateau = parsed(STAROBINSKY, ['V0', 'alpha']).bind({ V0: 1, alpha: 1 });
    if (!plateau.ok) throw new Error(plateau.problem.message);
    const k = Math.sqrt(2 / 3);
    expect(plateau.potential.dV(0)).toBe(0);
    expect(plateau.potential.d2V(0)).toBeCloseTo(2 * k ** 2, 14);
    expect(plateau.potential.d3V(0)).toBeCloseTo(-6 * k ** 3, 14);
    const quadratic = parsed('lambda * phi^p', ['lambda', 'p']).bind({ lambda: 3, p: 2 });
    if (!quadratic.ok) throw new Error(quadratic.problem.message);
    expect(quadratic.potential.d2V(0)).toBe(6);
    expect(quadratic.potential.d3V(0)).toBe(0);
  });

  it('does not use a simplified form that is undefined where the derivative is not (phi = 0)', () => {
    // A removable singularity of the kind simplify can introduce: the true form times phi/phi.
    simplify.mockImplementation(((node: MathNode) => math.parse(`(${node.toString()}) * phi / phi`)) as never);
    const result = parsed('cosh(phi)', []).bind({});
    if (!result.ok) throw new Error(result.problem.message);
    expect(result.potential.dV(0)).toBe(0);
    expect(result.potential.d2V(0)).toBe(1);
    expect(result.potential.d3V(0)).toBe(0);
    expect(result.potential.d2V(1.5)).toBeCloseTo(Math.cosh(1.5), 14);
  });

  it('does not use a simplified form with different values', () => {
    simplify.mockImplementation(((node: MathNode) => math.parse(`(${node.toString()}) * 1.000001`)) as never);
    const result = parsed('phi^3', []).bind({});
    if (!result.ok) throw new Error(result.problem.message);
    expect(result.potential.dV(2)).toBe(12);
    expect(result.potential.d2V(2)).toBe(12);
    expect(result.potential.d3V(2)).toBe(6);
  });
});

describe('when derivative fails', () => {
  it('reports the expression as not differentiable, naming the order', () => {
    derivative.mockImplementation(() => {
      throw new Error('Cannot process function "mystery" in derivative');
    });
    expect(parsePotential('sin(phi)', [])).toEqual({
      ok: false,
      problem: {
        message: 'The expression is not differentiable: its first derivative failed (Cannot process function "mystery" in derivative)',
      },
    });
  });

  it('reports a derivative that needs an unsupported function', () => {
    const real = derivative.getMockImplementation();
    if (!real) throw new Error('no real derivative');
    let calls = 0;
    derivative.mockImplementation(((...args: Parameters<typeof real>) =>
      ++calls === 2 ? math.parse('floor(phi)') : real(...args)) as never);
    const result = parsePotential('phi^3', []);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.problem.message).toMatch(
      /^The expression is not differentiable within the supported functions: its second derivative needs something unsupported \(Unsupported function 'floor'/,
    );
  });

  it('reports stack exhaustion as nesting too deep', () => {
    derivative.mockImplementation(() => {
      throw new RangeError('Maximum call stack size exceeded');
    });
    expect(parsePotential('sin(phi)', [])).toEqual({ ok: false, problem: { message: 'The expression is nested too deeply to be read' } });
  });
});
