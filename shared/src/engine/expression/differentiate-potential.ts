import type { MathNode } from 'mathjs/number';
import { compileTree } from './compile-tree.js';
import { fromMathNode, type ExpressionTree, type SymbolResolver, type Unsupported } from './expression-tree.js';
import { math } from './mathjs-instance.js';

/**
 * Largest derivative tree (in mathjs nodes) that is differentiated further. Each order multiplies
 * the size by up to the tree depth (nested chain rules), so without a cap a 300-character input
 * such as sin(sin(...)) reaches millions of nodes by the third derivative.
 */
export const MAX_DERIVATIVE_NODES = 10_000;

/**
 * Largest tree handed to mathjs simplify. Its cost grows much faster than linearly (about 0.3 s
 * for 180 nodes); bigger derivatives are used unsimplified, which is only slower to evaluate.
 */
export const MAX_SIMPLIFY_NODES = 300;

/** One derivative order, ready to compile. */
export interface Derivative {
  tree: ExpressionTree;
  /** For display: the simplified form when simplify succeeded, else the raw derivative. */
  text: string;
  /** Whether `tree` is the simplified form (false: simplify threw, was skipped or was refused). */
  simplified: boolean;
}

export type DerivativeFailure =
  | { reason: 'threw'; message: string }
  | { reason: 'too-large'; nodes: number }
  | { reason: 'too-deep' }
  | { reason: 'unsupported'; unsupported: Unsupported };

export type DerivativesResult =
  | { ok: true; derivatives: [Derivative, Derivative, Derivative] }
  | { ok: false; order: 1 | 2 | 3; failure: DerivativeFailure };

/**
 * dV, d2V and d3V of a validated potential, each derived once with mathjs `derivative` and then
 * simplified when that is safe.
 *
 * simplify may change the domain: for the Starobinsky plateau it turns d3V into a form with
 * 1 - exp(-k phi) in a denominator, which is 0/0 at phi = 0. So the simplified tree is used only
 * if it matches the raw derivative at a fixed set of sample points ({@link agreesOnSamples});
 * otherwise the raw tree is compiled and the next order is derived from it.
 *
 * @param parameterNames parameters the potential uses, for the sample points.
 * @param options.simplify false to skip simplify (and its cost of up to seconds): a check whether
 *   the potential is usable needs the derivatives to exist, not to be short.
 */
export function differentiateThreeTimes(
  potential: MathNode,
  resolve: SymbolResolver,
  parameterNames: readonly string[],
  { simplify = true }: { simplify?: boolean } = {},
): DerivativesResult {
  const derivatives: Derivative[] = [];
  let previous = potential;
  for (const order of [1, 2, 3] as const) {
    let raw: MathNode;
    try {
      raw = math.derivative(previous, 'phi', { simplify: false });
    } catch (error) {
      if (error instanceof RangeError) return { ok: false, order, failure: { reason: 'too-deep' } };
      return { ok: false, order, failure: { reason: 'threw', message: errorMessage(error) } };
    }
    const nodes = countNodes(raw);
    if (nodes > MAX_DERIVATIVE_NODES) return { ok: false, order, failure: { reason: 'too-large', nodes } };
    const rawTree = fromMathNode(raw, resolve, true);
    if (!rawTree.ok) return { ok: false, order, failure: { reason: 'unsupported', unsupported: rawTree.unsupported } };

    const simplified = simplify && nodes <= MAX_SIMPLIFY_NODES ? trySimplify(raw) : undefined;
    const text = (simplified ?? raw).toString();
    const simplifiedTree = simplified ? fromMathNode(simplified, resolve, true) : undefined;
    if (simplified && simplifiedTree?.ok && agreesOnSamples(rawTree.tree, simplifiedTree.tree, parameterNames)) {
      derivatives.push({ tree: simplifiedTree.tree, text, simplified: true });
      previous = simplified;
    } else {
      derivatives.push({ tree: rawTree.tree, text, simplified: false });
      previous = raw;
    }
  }
  return { ok: true, derivatives: derivatives as [Derivative, Derivative, Derivative] };
}

function trySimplify(node: MathNode): MathNode | undefined {
  try {
    return math.simplify(node);
  } catch {
    // simplify is an optimisation here; the raw derivative is still correct.
    return undefined;
  }
}

function countNodes(node: MathNode): number {
  let count = 0;
  node.traverse(() => {
    count++;
  });
  return count;
}

function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

// Fixed, deterministic samples: phi = 0 catches the removable singularities simplify likes to
// create at a plateau's minimum; the rest cover both signs and a large field value. Parameters
// get distinct positive values so no two cancel by accident, in two sets.
const PHI_SAMPLES = [0, 0.31, -0.31, 1.17, -1.17, 2.6, -2.6, 6.3];
const PARAMETER_SETS: readonly ((i: number) => number)[] = [(i) => 0.7 + 0.29 * i, (i) => 1.9 + 0.13 * i];
const RELATIVE_TOLERANCE = 1e-9;
// Absolute floor relative to the largest sample, so rounding noise around a zero is not a mismatch.
const SCALE_TOLERANCE = 1e-12;

/**
 * Whether `candidate` equals `reference` wherever the reference is finite, at the sample points.
 * A disagreement only costs speed (the reference is then used), never correctness.
 */
export function agreesOnSamples(
  reference: ExpressionTree,
  candidate: ExpressionTree,
  parameterNames: readonly string[],
): boolean {
  for (const valueOf of PARAMETER_SETS) {
    const parameters = new Map(parameterNames.map((name, i) => [name, valueOf(i)] as const));
    const f = compileTree(reference, parameters);
    const g = compileTree(candidate, parameters);
    const expected = PHI_SAMPLES.map(f);
    const scale = expected.reduce((max, v) => (Number.isFinite(v) ? Math.max(max, Math.abs(v)) : max), 0);
    for (let i = 0; i < PHI_SAMPLES.length; i++) {
      const want = expected[i];
      if (!Number.isFinite(want)) continue;
      const got = g(PHI_SAMPLES[i]);
      if (!Number.isFinite(got)) return false;
      const tolerance = RELATIVE_TOLERANCE * Math.max(Math.abs(want), Math.abs(got)) + SCALE_TOLERANCE * scale;
      if (Math.abs(got - want) > tolerance) return false;
    }
  }
  return true;
}
