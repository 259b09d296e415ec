import type { MathNode } from 'mathjs/number';

/**
 * Functions a potential may call. Each is one argument except `log`, which also takes a base
 * (`log(x, b)`). All of them are differentiable by mathjs `derivative` (checked in the specs).
 */
export const POTENTIAL_FUNCTIONS = [
  'sqrt',
  'exp',
  'log',
  'log10',
  'sin',
  'cos',
  'tan',
  'sec',
  'csc',
  'cot',
  'asin',
  'acos',
  'atan',
  'sinh',
  'cosh',
  'tanh',
  'sech',
  'csch',
  'coth',
  'asinh',
  'acosh',
  'atanh',
  'abs',
] as const;
export type PotentialFunctionName = (typeof POTENTIAL_FUNCTIONS)[number];

export type BinaryOperator = '+' | '-' | '*' | '/' | '^';

/**
 * The engine's own expression tree: the whitelisted subset of a mathjs tree, with parentheses,
 * unary plus and the constants pi and e already resolved. It is plain frozen data, so parsed
 * potentials keep no reference to mathjs objects.
 */
export type ExpressionTree =
  | { readonly kind: 'number'; readonly value: number }
  | { readonly kind: 'phi' }
  | { readonly kind: 'parameter'; readonly name: string }
  | { readonly kind: 'negate'; readonly arg: ExpressionTree }
  | { readonly kind: 'binary'; readonly op: BinaryOperator; readonly left: ExpressionTree; readonly right: ExpressionTree }
  | { readonly kind: 'call'; readonly fn: PotentialFunctionName; readonly arg: ExpressionTree }
  | { readonly kind: 'log-base'; readonly arg: ExpressionTree; readonly base: ExpressionTree };

/** Why a mathjs node falls outside the whitelist; turned into a located message by the caller. */
export type Unsupported =
  | { readonly reason: 'symbol'; readonly name: string }
  | { readonly reason: 'function'; readonly name: string }
  | { readonly reason: 'arity'; readonly name: string; readonly count: number }
  | { readonly reason: 'constant'; readonly value: unknown }
  | { readonly reason: 'operator'; readonly op: string; readonly fn: string }
  | { readonly reason: 'node'; readonly type: string };

export type ConversionResult = { ok: true; tree: ExpressionTree } | { ok: false; unsupported: Unsupported };

/** What a symbol name stands for; `undefined` means the name is not allowed. */
export type SymbolResolver = (name: string) => ExpressionTree | undefined;

const BINARY_BY_FN: Readonly<Record<string, BinaryOperator>> = {
  add: '+',
  subtract: '-',
  multiply: '*',
  divide: '/',
  pow: '^',
};

const FUNCTION_SET: ReadonlySet<string> = new Set(POTENTIAL_FUNCTIONS);

/** Returns true when `name` is one of {@link POTENTIAL_FUNCTIONS}. */
export function isPotentialFunction(name: string): name is PotentialFunctionName {
  return FUNCTION_SET.has(name);
}

/**
 * Converts a mathjs tree into an {@link ExpressionTree}, refusing anything outside the whitelist.
 * The first refusal in pre-order (roughly left to right in the source) is reported.
 *
 * @param allowNonFinite accept NaN/Infinity constants: user text may not contain them, but
 *   simplify can fold e.g. `1/0` inside a derivative and that must still compile.
 */
export function fromMathNode(node: MathNode, resolve: SymbolResolver, allowNonFinite = false): ConversionResult {
  const fail = (unsupported: Unsupported): ConversionResult => ({ ok: false, unsupported });
  const ok = (tree: ExpressionTree): ConversionResult => ({ ok: true, tree: Object.freeze(tree) });

  // mathjs's node typings are a wide union; reading the few fields we need through this view keeps
  // the switch below free of casts.
  const n = node as unknown as {
    type: string;
    value?: unknown;
    name?: string;
    content?: MathNode;
    op?: string;
    fn?: string | { type: string; name?: string };
    args?: MathNode[];
  };

  switch (n.type) {
    case 'ConstantNode': {
      const value = n.value;
      if (typeof value !== 'number' || (!allowNonFinite && !Number.isFinite(value))) {
        return fail({ reason: 'constant', value });
      }
      return ok({ kind: 'number', value });
    }
    case 'SymbolNode': {
      const name = n.name ?? '';
      const tree = resolve(name);
      return tree ? ok(tree) : fail({ reason: 'symbol', name });
    }
    case 'ParenthesisNode':
      return fromMathNode(n.content as MathNode, resolve, allowNonFinite);
    case 'OperatorNode': {
      const fnName = typeof n.fn === 'string' ? n.fn : '';
      const args = n.args ?? [];
      if ((fnName === 'unaryMinus' || fnName === 'unaryPlus') && args.length === 1) {
        const inner = fromMathNode(args[0], resolve, allowNonFinite);
        if (!inner.ok || fnName === 'unaryPlus') return inner;
        return ok({ kind: 'negate', arg: inner.tree });
      }
      const op = BINARY_BY_FN[fnName];
      // simplify may hand back n-ary sums and products; only + and * are associative enough to fold.
      const nAryAllowed = op === '+' || op === '*';
      if (op === undefined || args.length < 2 || (args.length > 2 && !nAryAllowed)) {
        return fail({ reason: 'operator', op: n.op ?? fnName, fn: fnName });
      }
      const first = fromMathNode(args[0], resolve, allowNonFinite);
      if (!first.ok) return first;
      let tree = first.tree;
      for (let i = 1; i < args.length; i++) {
        const next = fromMathNode(args[i], resolve, allowNonFinite);
        if (!next.ok) return next;
        tree = Object.freeze({ kind: 'binary', op, left: tree, right: next.tree });
      }
      return ok(tree);
    }
    case 'FunctionNode': {
      const callee = n.fn;
      if (typeof callee !== 'object' || callee.type !== 'SymbolNode' || callee.name === undefined) {
        return fail({ reason: 'node', type: 'FunctionNode' });
      }
      const name = callee.name;
      if (!isPotentialFunction(name)) return fail({ reason: 'function', name });
      const args = n.args ?? [];
      const arityOk = args.length === 1 || (name === 'log' && args.length === 2);
      if (!arityOk) return fail({ reason: 'arity', name, count: args.length });
      const arg = fromMathNode(args[0], resolve, allowNonFinite);
      if (!arg.ok) return arg;
      if (args.length === 2) {
        const base = fromMathNode(args[1], resolve, allowNonFinite);
        if (!base.ok) return base;
        return ok({ kind: 'log-base', arg: arg.tree, base: base.tree });
      }
      return ok({ kind: 'call', fn: name, arg: arg.tree });
    }
    default:
      return fail({ reason: 'node', type: n.type });
  }
}

/** Whether `tree` mentions phi anywhere. */
export function dependsOnPhi(tree: ExpressionTree): boolean {
  switch (tree.kind) {
    case 'phi':
      return true;
    case 'number':
    case 'parameter':
      return false;
    case 'negate':
    case 'call':
      return dependsOnPhi(tree.arg);
    case 'binary':
      return dependsOnPhi(tree.left) || dependsOnPhi(tree.right);
    case 'log-base':
      return dependsOnPhi(tree.arg) || dependsOnPhi(tree.base);
  }
}

/** Parameter names that occur in `tree`, added to `into`. */
export function collectParameters(tree: ExpressionTree, into: Set<string>): Set<string> {
  switch (tree.kind) {
    case 'parameter':
      into.add(tree.name);
      break;
    case 'negate':
    case 'call':
      collectParameters(tree.arg, into);
      break;
    case 'binary':
      collectParameters(tree.left, into);
      collectParameters(tree.right, into);
      break;
    case 'log-base':
      collectParameters(tree.arg, into);
      collectParameters(tree.base, into);
      break;
    default:
      break;
  }
  return into;
}
