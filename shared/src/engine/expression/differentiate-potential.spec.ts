import { describe, expect, it } from 'vitest';
import { compileTree } from './compile-tree.js';
import { agreesOnSamples, differentiateThreeTimes } from './differentiate-potential.js';
import { fromMathNode, type ExpressionTree, type SymbolResolver } from './expression-tree.js';
import { math } from './mathjs-instance.js';

const resolve: SymbolResolver = (name) =>
  name === 'phi' ? { kind: 'phi' } : ['V0', 'alpha', 'a'].includes(name) ? { kind: 'parameter', name } : undefined;

function tree(source: string): ExpressionTree {
  const result = fromMathNode(math.parse(source), resolve, true);
  if (!result.ok) throw new Error(JSON.stringify(result.unsupported));
  return result.tree;
}

describe('agreesOnSamples', () => {
  it('refuses the simplified Starobinsky V\'\'\' that mathjs makes from the raw third derivative', () => {
    // Differentiating three times without simplifying, then simplifying once, gives a form with
    // 1 - exp(-k phi) in a denominator: 0/0 at phi = 0, where V''' is finite.
    let raw = math.parse('V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2');
    for (let i = 0; i < 3; i++) raw = math.derivative(raw, 'phi', { simplify: false });
    const simplified = math.simplify(raw);
    expect(simplified.toString()).toContain('/ (1 - exp(');
    const values = new Map([
      ['V0', 1],
      ['alpha', 1],
    ]);
    expect(compileTree(tree(raw.toString()), values)(0)).toBeCloseTo(-6 * Math.sqrt(2 / 3) ** 3, 12);
    expect(compileTree(tree(simplified.toString()), values)(0)).toBeNaN();
    expect(agreesOnSamples(tree(raw.toString()), tree(simplified.toString()), ['V0', 'alpha'])).toBe(false);
  });

  it('accepts a correct rewrite', () => {
    expect(agreesOnSamples(tree('a * (phi + 1)^2'), tree('a * phi^2 + 2 * a * phi + a'), ['a'])).toBe(true);
  });

  it('accepts a rewrite that is defined where the reference is not', () => {
    expect(agreesOnSamples(tree('phi / phi * a'), tree('a'), ['a'])).toBe(true);
  });

  it('refuses a rewrite that is off by one part in a million', () => {
    expect(agreesOnSamples(tree('exp(a * phi)'), tree('1.000001 * exp(a * phi)'), ['a'])).toBe(false);
  });

  it('tolerates rounding noise around a zero', () => {
    // sin(phi)^2 + cos(phi)^2 - 1 is 0 up to rounding; 0 must be accepted for it.
    expect(agreesOnSamples(tree('a * (sin(phi)^2 + cos(phi)^2 - 1) + phi'), tree('phi'), ['a'])).toBe(true);
  });
});

describe('differentiateThreeTimes', () => {
  it('simplifies each order and keeps the simplified trees when they agree', () => {
    const result = differentiateThreeTimes(math.parse('a * phi^4'), resolve, ['a']);
    if (!result.ok) throw new Error(JSON.stringify(result));
    expect(result.derivatives.map((d) => d.text)).toEqual(['4 * a * phi ^ 3', '12 * a * phi ^ 2', '24 * a * phi']);
    expect(result.derivatives.map((d) => d.simplified)).toEqual([true, true, true]);
    const f = compileTree(result.derivatives[2].tree, new Map([['a', 0.5]]));
    expect(f(3)).toBe(36);
  });
});
