import { compileTree } from './compile-tree.js';
import { collectParameters, dependsOnPhi, type ExpressionTree } from './expression-tree.js';

/** A parameter that only scales V, as V = parameter^power · g(φ, the other parameters). */
export interface PotentialScale {
  parameter: string;
  power: number;
}

/** One factor of V's top-level product, raised to `power`. */
interface Factor {
  tree: ExpressionTree;
  power: number;
}

/**
 * The parameter c with V = c^k · g(φ, other parameters), k a nonzero number and c nowhere in g,
 * read symbolically from the tree: V's top level is flattened into a product of factors (through
 * *, /, unary minus, sqrt and powers with a constant exponent), and c is a scale when it appears
 * only as a bare factor; k sums its exponents there. Flattening a power, (x·y)^k = x^k·y^k, holds
 * for c > 0, the only values that are ever rescaled. Of several candidates the first in
 * `parameterNames` is taken, so the answer depends on the declaration order only.
 *
 * @returns undefined when no parameter only scales V
 */
export function detectScale(tree: ExpressionTree, parameterNames: readonly string[]): PotentialScale | undefined {
  const factors: Factor[] = [];
  flatten(tree, 1, factors);
  for (const name of parameterNames) {
    let power = 0;
    let elsewhere = false;
    for (const factor of factors) {
      if (factor.tree.kind === 'parameter' && factor.tree.name === name) power += factor.power;
      else if (collectParameters(factor.tree, new Set()).has(name)) elsewhere = true;
    }
    if (!elsewhere && power !== 0 && Number.isFinite(power)) return { parameter: name, power };
  }
  return undefined;
}

function flatten(tree: ExpressionTree, power: number, into: Factor[]): void {
  if (tree.kind === 'negate') return flatten(tree.arg, power, into);
  if (tree.kind === 'call' && tree.fn === 'sqrt') return flatten(tree.arg, power / 2, into);
  if (tree.kind === 'binary') {
    if (tree.op === '*' || tree.op === '/') {
      flatten(tree.left, power, into);
      flatten(tree.right, tree.op === '*' ? power : -power, into);
      return;
    }
    const exponent = tree.op === '^' ? constantValue(tree.right) : undefined;
    if (exponent !== undefined) return flatten(tree.left, power * exponent, into);
  }
  into.push({ tree, power });
}

/** The value of a subtree with neither φ nor parameters (e.g. `2`, `1/3`, `2*2`), else undefined. */
function constantValue(tree: ExpressionTree): number | undefined {
  if (dependsOnPhi(tree) || collectParameters(tree, new Set()).size > 0) return undefined;
  const value = compileTree(tree, new Map())(0);
  return Number.isFinite(value) ? value : undefined;
}
