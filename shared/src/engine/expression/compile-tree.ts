import type { BinaryOperator, ExpressionTree, PotentialFunctionName } from './expression-tree.js';

/** A function of the field value phi (reduced Planck units). */
export type ScalarFunction = (phi: number) => number;

/** A compiled sub-tree: a plain number when it does not depend on phi, else a closure. */
type Compiled = number | ScalarFunction;

// The reciprocal functions follow mathjs's number definitions (e.g. cot(x) = 1 / tan(x)), so a
// compiled tree agrees with what simplify folded at parse time.
const FUNCTIONS: Readonly<Record<PotentialFunctionName, (x: number) => number>> = {
  sqrt: Math.sqrt,
  exp: Math.exp,
  log: Math.log,
  log10: Math.log10,
  sin: Math.sin,
  cos: Math.cos,
  tan: Math.tan,
  sec: (x) => 1 / Math.cos(x),
  csc: (x) => 1 / Math.sin(x),
  cot: (x) => 1 / Math.tan(x),
  asin: Math.asin,
  acos: Math.acos,
  atan: Math.atan,
  sinh: Math.sinh,
  cosh: Math.cosh,
  tanh: Math.tanh,
  sech: (x) => 1 / Math.cosh(x),
  csch: (x) => 1 / Math.sinh(x),
  coth: (x) => 1 / Math.tanh(x),
  asinh: Math.asinh,
  acosh: Math.acosh,
  atanh: Math.atanh,
  abs: Math.abs,
};

const PHI: ScalarFunction = (phi) => phi;

/**
 * Compiles `tree` into a closure of phi with the parameter values fixed.
 *
 * Sub-trees without phi are folded to numbers once, here; the returned closure only does
 * arithmetic and `Math.*` calls, allocates nothing and never reads the tree again. Integer powers
 * 2, 3 and 4 become multiplications; x*1, x/1, x+0, x-0 and x^1 are dropped.
 *
 * A factor that folds to exactly 0 makes the whole product (or quotient 0/x) 0, even where the
 * other factor is infinite. That is the continuous extension, and it matters: the power rule
 * leaves terms like (n - 2) * f^(n - 3) in unsimplified derivatives, which for n = 2 would
 * otherwise be 0 * Infinity = NaN wherever f = 0 (e.g. the Starobinsky minimum, or lambda*phi^p
 * with p bound to 2 at phi = 0).
 *
 * @param parameters value of every parameter the tree mentions; a missing one is a programming
 *   error (callers validate first) and throws.
 */
export function compileTree(
  tree: ExpressionTree,
  parameters: ReadonlyMap<string, number>,
  shared: Map<string, ScalarFunction> = new Map(),
): ScalarFunction {
  const compiled = compileNode(tree, parameters, shared);
  if (typeof compiled === 'number') return () => compiled;
  return compiled;
}

/**
 * Function calls (exp, sin, …) are the costly nodes, and V, V', V'' repeat them: the same
 * sub-tree, compiled once per `shared` map, remembers its last argument and value, so the
 * integrator's V(φ) then V'(φ) at one φ computes each exp once. Pure: the result depends on φ only.
 */
function memoizedCall(f: (x: number) => number, a: ScalarFunction): ScalarFunction {
  let lastPhi = NaN;
  let lastValue = NaN;
  return (phi) => {
    if (phi === lastPhi) return lastValue;
    lastValue = f(a(phi));
    lastPhi = phi;
    return lastValue;
  };
}

function compileNode(tree: ExpressionTree, parameters: ReadonlyMap<string, number>, shared: Map<string, ScalarFunction>): Compiled {
  const recurse = (t: ExpressionTree) => compileNode(t, parameters, shared);
  switch (tree.kind) {
    case 'number':
      return tree.value;
    case 'phi':
      return PHI;
    case 'parameter': {
      const value = parameters.get(tree.name);
      if (value === undefined) throw new Error(`No value bound for parameter '${tree.name}'`);
      return value;
    }
    case 'negate': {
      const a = recurse(tree.arg);
      return typeof a === 'number' ? -a : (phi) => -a(phi);
    }
    case 'call': {
      const f = FUNCTIONS[tree.fn];
      const a = recurse(tree.arg);
      if (typeof a === 'number') return f(a);
      const key = JSON.stringify(tree);
      let fn = shared.get(key);
      if (!fn) {
        fn = memoizedCall(f, a);
        shared.set(key, fn);
      }
      return fn;
    }
    case 'log-base':
      return compileLogBase(recurse(tree.arg), recurse(tree.base));
    case 'binary':
      return compileBinary(tree.op, recurse(tree.left), recurse(tree.right));
  }
}

// mathjs's number log(x, b) is log(x) / log(b); the same order of operations keeps the results equal.
function compileLogBase(a: Compiled, b: Compiled): Compiled {
  if (typeof a === 'number' && typeof b === 'number') return Math.log(a) / Math.log(b);
  if (typeof b === 'number') {
    const logB = Math.log(b);
    const fa = a as ScalarFunction;
    return (phi) => Math.log(fa(phi)) / logB;
  }
  if (typeof a === 'number') {
    const logA = Math.log(a);
    return (phi) => logA / Math.log(b(phi));
  }
  return (phi) => Math.log(a(phi)) / Math.log(b(phi));
}

function compileBinary(op: BinaryOperator, a: Compiled, b: Compiled): Compiled {
  if (typeof a === 'number' && typeof b === 'number') return applyBinary(op, a, b);
  switch (op) {
    case '+':
      if (typeof b === 'number') return b === 0 ? a : addConstant(a as ScalarFunction, b);
      if (typeof a === 'number') return a === 0 ? b : addConstant(b, a);
      return (phi) => a(phi) + b(phi);
    case '-':
      if (typeof b === 'number') return b === 0 ? a : addConstant(a as ScalarFunction, -b);
      if (typeof a === 'number') return (phi) => a - b(phi);
      return (phi) => a(phi) - b(phi);
    case '*':
      if (typeof b === 'number') return b === 0 ? 0 : b === 1 ? a : scale(a as ScalarFunction, b);
      if (typeof a === 'number') return a === 0 ? 0 : a === 1 ? b : scale(b, a);
      return (phi) => a(phi) * b(phi);
    case '/':
      if (typeof b === 'number') return b === 1 ? a : divideBy(a as ScalarFunction, b);
      if (typeof a === 'number') return a === 0 ? 0 : (phi) => a / b(phi);
      return (phi) => a(phi) / b(phi);
    case '^':
      if (typeof b === 'number') return constantPower(a as ScalarFunction, b);
      if (typeof a === 'number') return (phi) => Math.pow(a, b(phi));
      return (phi) => Math.pow(a(phi), b(phi));
  }
}

function applyBinary(op: BinaryOperator, a: number, b: number): number {
  switch (op) {
    case '+':
      return a + b;
    case '-':
      return a - b;
    case '*':
      return a * b;
    case '/':
      return a / b;
    case '^':
      return Math.pow(a, b);
  }
}

function addConstant(f: ScalarFunction, c: number): ScalarFunction {
  return (phi) => f(phi) + c;
}

function scale(f: ScalarFunction, c: number): ScalarFunction {
  return (phi) => f(phi) * c;
}

// Division is kept as division (not multiplication by 1/c) so results match the source exactly.
function divideBy(f: ScalarFunction, c: number): ScalarFunction {
  return (phi) => f(phi) / c;
}

function constantPower(f: ScalarFunction, exponent: number): Compiled {
  switch (exponent) {
    // Math.pow(x, 0) is 1 for every x, NaN included.
    case 0:
      return 1;
    case 1:
      return f;
    case 2:
      return (phi) => {
        const v = f(phi);
        return v * v;
      };
    case 3:
      return (phi) => {
        const v = f(phi);
        return v * v * v;
      };
    case 4:
      return (phi) => {
        const v = f(phi);
        const v2 = v * v;
        return v2 * v2;
      };
    default:
      return (phi) => Math.pow(f(phi), exponent);
  }
}
