import { describe, expect, it } from 'vitest';
import { compileTree } from './compile-tree.js';
import { fromMathNode, type ExpressionTree } from './expression-tree.js';
import { math } from './mathjs-instance.js';

function compile(source: string, parameters: Record<string, number> = {}) {
  const converted = fromMathNode(math.parse(source), (name) =>
    name === 'phi' ? { kind: 'phi' } : name in parameters ? { kind: 'parameter', name } : undefined,
  );
  if (!converted.ok) throw new Error(JSON.stringify(converted.unsupported));
  return compileTree(converted.tree, new Map(Object.entries(parameters)));
}

describe('compileTree', () => {
  it('evaluates the reciprocal functions as mathjs defines them', () => {
    const x = 0.7;
    expect(compile('sec(phi)')(x)).toBe(1 / Math.cos(x));
    expect(compile('csc(phi)')(x)).toBe(1 / Math.sin(x));
    expect(compile('cot(phi)')(x)).toBe(1 / Math.tan(x));
    expect(compile('sech(phi)')(x)).toBe(1 / Math.cosh(x));
    expect(compile('csch(phi)')(x)).toBe(1 / Math.sinh(x));
    expect(compile('coth(phi)')(x)).toBe(1 / Math.tanh(x));
  });

  it('a factor that folds to zero annihilates the product, also against an infinite factor', () => {
    expect(compile('phi * 0')(Infinity)).toBe(0);
    expect(compile('(p - 2) * phi^(p - 3)', { p: 2 })(0)).toBe(0);
    expect(compile('c * log(phi^2) + 1', { c: 0 })(0)).toBe(1);
    expect(compile('0 / phi')(0)).toBe(0);
    // A non-zero coefficient keeps the singularity, and a zero that depends on phi is not folded.
    expect(compile('(p - 2) * phi^(p - 3)', { p: 2.5 })(0)).toBe(0.5 * Infinity);
    expect(compile('(phi - 1) * log(phi - 1)')(1)).toBeNaN();
  });

  it('otherwise keeps Math semantics', () => {
    expect(compile('phi^0')(NaN)).toBe(1);
    expect(compile('sqrt(phi)')(-1)).toBeNaN();
    expect(compile('log(phi)')(0)).toBe(-Infinity);
  });

  it('returns a constant function for a tree without phi', () => {
    const f = compile('a^2 + 1', { a: 3 });
    expect(f(0)).toBe(10);
    expect(f(123)).toBe(10);
  });

  it('agrees with operator precedence of the source', () => {
    const f = compile('-phi^2 + 2^phi^2 / 4 - (phi - 1) * 3', {});
    const x = 1.3;
    expect(f(x)).toBe(-(x ** 2) + 2 ** (x ** 2) / 4 - (x - 1) * 3);
  });

  it('log with a base divides natural logarithms', () => {
    expect(compile('log(phi, 2)')(8)).toBe(Math.log(8) / Math.log(2));
    expect(compile('log(8, phi)')(2)).toBe(Math.log(8) / Math.log(2));
  });

  it('throws on a parameter without a value (callers validate first)', () => {
    const tree: ExpressionTree = { kind: 'binary', op: '*', left: { kind: 'parameter', name: 'a' }, right: { kind: 'phi' } };
    expect(() => compileTree(tree, new Map())).toThrow("No value bound for parameter 'a'");
  });
});
