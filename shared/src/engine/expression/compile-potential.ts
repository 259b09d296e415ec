import type { MathNode } from 'mathjs/number';
import { compileTree } from './compile-tree.js';
import { detectScale, type PotentialScale } from './detect-scale.js';
import { differentiateThreeTimes, MAX_DERIVATIVE_NODES, type DerivativeFailure } from './differentiate-potential.js';
import {
  collectParameters,
  dependsOnPhi,
  fromMathNode,
  isPotentialFunction,
  POTENTIAL_FUNCTIONS,
  type ExpressionTree,
  type SymbolResolver,
  type Unsupported,
} from './expression-tree.js';
import { locateIdentifier, locateOperator, locatePattern, type SourceSpan } from './locate-in-source.js';
import { math } from './mathjs-instance.js';

/** Longest accepted potential, in characters. */
export const MAX_POTENTIAL_LENGTH = 2000;

/** V and its derivatives for fixed parameter values, in reduced Planck units (M_pl = 1). */
export interface CompiledPotential {
  /** V, V', V'', V''' at phi for fixed parameter values; each writes nothing and allocates nothing. */
  V(phi: number): number;
  dV(phi: number): number;
  d2V(phi: number): number;
  d3V(phi: number): number;
  /** The derivative expressions as simplified text, for display. */
  derivatives: { dV: string; d2V: string; d3V: string };
  /** Parameters the expression actually uses, in the order they were declared. */
  parameterNames: string[];
}

/** Why an expression or a set of parameter values was refused, in words a user can act on. */
export interface ExpressionProblem {
  message: string;
  /** 0-based character offset in the source, when known */
  index?: number;
  length?: number;
}

export type PotentialBindResult = { ok: true; potential: CompiledPotential } | { ok: false; problem: ExpressionProblem };

/** A potential parsed, checked and differentiated once; bind it to parameter values to evaluate. */
export interface ParsedPotential {
  /** The text as given. */
  readonly source: string;
  /** Every declared parameter; bind() needs a value for each. */
  readonly declaredParameterNames: readonly string[];
  /** Declared parameters the expression actually uses, in declaration order. */
  readonly parameterNames: readonly string[];
  /** dV, d2V and d3V as text, for display. */
  readonly derivatives: { readonly dV: string; readonly d2V: string; readonly d3V: string };
  /** The parameter that only scales V (V ∝ parameter^power), when there is one (`detectScale`). */
  readonly scale?: PotentialScale;
  /**
   * Closes the compiled functions over these parameter values. Cheap: no mathjs, only closure
   * creation and constant folding. Refuses missing, unknown or non-finite values.
   */
  bind(params: Readonly<Record<string, number>>): PotentialBindResult;
}

export type PotentialParseResult = { ok: true; potential: ParsedPotential } | { ok: false; problem: ExpressionProblem };

const CONSTANTS: Readonly<Record<string, ExpressionTree>> = {
  pi: Object.freeze({ kind: 'number', value: Math.PI }),
  e: Object.freeze({ kind: 'number', value: Math.E }),
};
const PHI_TREE: ExpressionTree = Object.freeze({ kind: 'phi' });

const PARAMETER_NAME = /^[A-Za-z][A-Za-z0-9_]*$/;
// Words mathjs's parser reads as operators or literals, so a parameter so named could never be used.
const PARSER_WORDS = ['mod', 'to', 'in', 'and', 'or', 'xor', 'not', 'true', 'false', 'null', 'undefined', 'NaN', 'Infinity'];
const RESERVED_NAMES: ReadonlySet<string> = new Set(['phi', 'pi', 'e', ...POTENTIAL_FUNCTIONS, ...PARSER_WORDS]);

const FUNCTION_LIST = POTENTIAL_FUNCTIONS.join(', ');

/**
 * Parses a potential V(phi) written in math.js syntax, checks it against the whitelist and derives
 * V', V'' and V''' symbolically. All mathjs work happens here, once; see {@link ParsedPotential.bind}.
 *
 * @param source the expression, e.g. `V0 * (1 - exp(-sqrt(2/(3*alpha)) * phi))^2`
 * @param parameterNames names the expression may use besides phi, pi and e
 * @param options.simplify false for a validity check only: the derivatives are left unsimplified
 *   (as for any derivative too large to simplify), which saves up to seconds
 * @returns the parsed potential, or the first problem found with its position in `source`
 */
export function parsePotential(source: string, parameterNames: readonly string[], options: { simplify?: boolean } = {}): PotentialParseResult {
  const fail = (problem: ExpressionProblem): PotentialParseResult => ({ ok: false, problem });

  if (source.length > MAX_POTENTIAL_LENGTH) {
    return fail({
      message: `The expression is ${source.length} characters long; the limit is ${MAX_POTENTIAL_LENGTH}`,
      index: MAX_POTENTIAL_LENGTH,
      length: source.length - MAX_POTENTIAL_LENGTH,
    });
  }
  const namesProblem = checkParameterNames(parameterNames);
  if (namesProblem) return fail(namesProblem);
  const declared = Object.freeze([...parameterNames]);
  if (source.trim() === '') return fail({ message: 'The expression is empty: write V in terms of phi, e.g. lambda * phi^4' });

  let node: MathNode;
  try {
    node = math.parse(source);
  } catch (error) {
    return fail(parseErrorProblem(error, source));
  }
  // A trailing newline or semicolon makes a block of one expression; that is still one expression.
  const blocks = (node as unknown as { blocks?: { node: MathNode }[] }).blocks;
  if (node.type === 'BlockNode' && blocks?.length === 1) node = blocks[0].node;
  // A comment alone parses to an empty constant.
  if (node.type === 'ConstantNode' && (node as unknown as { value: unknown }).value === undefined) {
    return fail({ message: 'The expression is empty: write V in terms of phi, e.g. lambda * phi^4' });
  }

  const known = new Set(declared);
  const resolve: SymbolResolver = (name) => {
    if (name === 'phi') return PHI_TREE;
    if (known.has(name)) return Object.freeze({ kind: 'parameter', name });
    return CONSTANTS[name];
  };
  let converted;
  try {
    converted = fromMathNode(node, resolve);
  } catch (error) {
    if (error instanceof RangeError) return fail(tooDeep());
    throw error;
  }
  if (!converted.ok) return fail(unsupportedProblem(converted.unsupported, source, declared));
  const tree = converted.tree;
  if (!dependsOnPhi(tree)) {
    return fail({ message: 'The expression does not depend on phi: V must be a function of the field phi' });
  }

  const used = collectParameters(tree, new Set());
  const usedNames = Object.freeze(declared.filter((name) => used.has(name)));
  let differentiated;
  try {
    differentiated = differentiateThreeTimes(node, resolve, usedNames, options);
  } catch (error) {
    if (error instanceof RangeError) return fail(tooDeep());
    throw error;
  }
  if (!differentiated.ok) return fail(derivativeProblem(differentiated.order, differentiated.failure, source, declared));

  const [first, second, third] = differentiated.derivatives;
  const trees = { V: tree, dV: first.tree, d2V: second.tree, d3V: third.tree };
  const derivatives = Object.freeze({ dV: first.text, d2V: second.text, d3V: third.text });
  const scale = detectScale(tree, usedNames);

  const potential: ParsedPotential = {
    source,
    declaredParameterNames: declared,
    parameterNames: usedNames,
    derivatives,
    ...(scale && { scale: Object.freeze(scale) }),
    bind(params) {
      const values = checkParameterValues(params, declared);
      if (!values.ok) return values;
      // One map per bind: V, V', V'', V''' of these parameter values share their function calls.
      const shared = new Map<string, (phi: number) => number>();
      const compiled: CompiledPotential = {
        V: compileTree(trees.V, values.map, shared),
        dV: compileTree(trees.dV, values.map, shared),
        d2V: compileTree(trees.d2V, values.map, shared),
        d3V: compileTree(trees.d3V, values.map, shared),
        derivatives: { ...derivatives },
        parameterNames: [...usedNames],
      };
      return { ok: true, potential: Object.freeze(compiled) };
    },
  };
  return { ok: true, potential: Object.freeze(potential) };
}

/**
 * Why `name` cannot be a parameter of a potential (its form, or a reserved word), or undefined
 * when it can. Pure, for forms that check one name at a time.
 */
export function parameterNameProblem(name: string): string | undefined {
  if (!PARAMETER_NAME.test(name)) {
    return `Parameter name '${name}' is not allowed: start with a letter and use letters, digits and _`;
  }
  if (RESERVED_NAMES.has(name)) {
    return `Parameter name '${name}' is reserved: phi, pi, e, the function names and ${PARSER_WORDS.join(', ')} cannot be parameters`;
  }
  return undefined;
}

function checkParameterNames(names: readonly string[]): ExpressionProblem | undefined {
  const seen = new Set<string>();
  for (const name of names) {
    const problem = parameterNameProblem(name);
    if (problem) return { message: problem };
    if (seen.has(name)) return { message: `Parameter '${name}' is declared twice` };
    seen.add(name);
  }
  return undefined;
}

function checkParameterValues(
  params: Readonly<Record<string, number>>,
  declared: readonly string[],
): { ok: true; map: Map<string, number> } | { ok: false; problem: ExpressionProblem } {
  const map = new Map<string, number>();
  for (const name of declared) {
    if (!Object.hasOwn(params, name)) return { ok: false, problem: { message: `Parameter '${name}' has no value` } };
    const value: unknown = params[name];
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      return { ok: false, problem: { message: `Parameter '${name}' must be a finite number, not ${String(value)}` } };
    }
    map.set(name, value);
  }
  // A value for a name the model does not declare means the caller and the model disagree.
  const declaredSet = new Set(declared);
  for (const name of Object.keys(params)) {
    if (!declaredSet.has(name)) {
      return { ok: false, problem: { message: `'${name}' is not a parameter of this potential (${listOrNone(declared)})` } };
    }
  }
  return { ok: true, map };
}

function parseErrorProblem(error: unknown, source: string): ExpressionProblem {
  if (error instanceof RangeError) return tooDeep();
  if (!(error instanceof SyntaxError)) {
    return { message: `The expression could not be read: ${error instanceof Error ? error.message : String(error)}` };
  }
  // mathjs reports the 1-based column of the offending token as "(char N)" and in error.char.
  const char = (error as SyntaxError & { char?: unknown }).char;
  let reason = error.message.replace(/\s*\(char \d+\)\s*$/, '');
  const part = /^Syntax error in part "([\s\S]*)"$/.exec(reason);
  if (part) reason = `unexpected "${part[1]}"`;
  reason = reason.charAt(0).toLowerCase() + reason.slice(1);
  if (typeof char !== 'number') return { message: `Syntax error: ${reason}` };
  const index = Math.min(Math.max(char - 1, 0), source.length);
  if (index >= source.length) return { message: `Syntax error at the end of the expression: ${reason}`, index, length: 0 };
  return { message: `Syntax error at character ${index + 1}: ${reason}`, index, length: part ? part[1].length : 1 };
}

function tooDeep(): ExpressionProblem {
  return { message: 'The expression is nested too deeply to be read' };
}

function at(span: SourceSpan | undefined): string {
  return span ? ` at character ${span.index + 1}` : '';
}

function located(message: string, span: SourceSpan | undefined): ExpressionProblem {
  return span ? { message, index: span.index, length: span.length } : { message };
}

function listOrNone(names: readonly string[]): string {
  return names.length > 0 ? `parameters: ${names.join(', ')}` : 'it has no parameters';
}

const SYNTAX_BY_NODE: Readonly<Record<string, { what: string; find: (source: string) => SourceSpan | undefined }>> = {
  AssignmentNode: { what: 'assignment (=)', find: (s) => locateOperator(s, '=') },
  FunctionAssignmentNode: { what: 'defining a function (=)', find: (s) => locateOperator(s, '=') },
  ArrayNode: { what: 'matrices and vectors ([...])', find: (s) => locatePattern(s, /\[/) },
  RangeNode: { what: 'ranges (a:b)', find: (s) => locatePattern(s, /:/) },
  ConditionalNode: { what: 'conditionals (a ? b : c)', find: (s) => locatePattern(s, /\?/) },
  RelationalNode: { what: 'comparisons', find: (s) => locatePattern(s, /[<>]=?|[=!]=/) },
  ObjectNode: { what: 'objects ({...})', find: (s) => locatePattern(s, /\{/) },
  AccessorNode: { what: 'property and index access', find: (s) => locatePattern(s, /\[|(?<=[\p{L}\p{N}_)\]])\.(?=[\p{L}_$])/u) },
  IndexNode: { what: 'indexing ([...])', find: (s) => locatePattern(s, /\[/) },
  BlockNode: { what: 'several expressions (; or a line break)', find: locateSeparator },
  FunctionNode: { what: 'calling an expression as a function', find: () => undefined },
};

const OPERATOR_KIND: Readonly<Record<string, string>> = {
  larger: 'comparisons',
  smaller: 'comparisons',
  largerEq: 'comparisons',
  smallerEq: 'comparisons',
  equal: 'comparisons',
  unequal: 'comparisons',
  factorial: 'factorial (!)',
  mod: 'modulo',
  and: 'logical operators',
  or: 'logical operators',
  xor: 'logical operators',
  not: 'logical operators',
  bitAnd: 'bitwise operators',
  bitOr: 'bitwise operators',
  bitXor: 'bitwise operators',
  bitNot: 'bitwise operators',
  leftShift: 'bitwise operators',
  rightArithShift: 'bitwise operators',
  rightLogShift: 'bitwise operators',
  dotMultiply: 'element-wise operators',
  dotDivide: 'element-wise operators',
  dotPow: 'element-wise operators',
  ctranspose: "transpose (')",
  transpose: "transpose (')",
  to: 'unit conversion',
  nullish: 'the ?? operator',
};

const ALLOWED_SYNTAX = 'use numbers, phi, parameters, + - * / ^, parentheses and functions';

function unsupportedProblem(unsupported: Unsupported, source: string, declared: readonly string[]): ExpressionProblem {
  switch (unsupported.reason) {
    case 'symbol': {
      const { name } = unsupported;
      const span = locateIdentifier(source, name, 'symbol');
      if (isPotentialFunction(name)) {
        return located(`Unknown symbol '${name}'${at(span)}: ${name} is a function, write ${name}(...)`, span);
      }
      const choices = declared.length > 0 ? `use phi or one of the parameters ${declared.join(', ')}` : 'use phi (this potential has no parameters)';
      const hint = suggestion(name, ['phi', 'pi', ...declared]);
      return located(`Unknown symbol '${name}'${at(span)}: ${choices}${hint}`, span);
    }
    case 'function': {
      const { name } = unsupported;
      const span = locateIdentifier(source, name, 'function');
      if (name === 'phi' || declared.includes(name)) {
        return located(`'${name}'${at(span)} is not a function: write ${name} * (...) for a product`, span);
      }
      return located(`Unsupported function '${name}'${at(span)}: use one of ${FUNCTION_LIST}`, span);
    }
    case 'arity': {
      const { name, count } = unsupported;
      const span = locateIdentifier(source, name, 'function');
      const takes = name === 'log' ? '1 or 2 arguments, log(x) or log(x, base)' : '1 argument';
      return located(`Function '${name}'${at(span)} takes ${takes}, not ${count}`, span);
    }
    case 'constant': {
      const { value } = unsupported;
      if (typeof value === 'string') {
        const span = locatePattern(source, /["']/);
        return located(`Text in quotes${at(span)} is not allowed: ${ALLOWED_SYNTAX}`, span);
      }
      if (typeof value === 'number') {
        const span = locateNonFinite(source, value);
        return located(`The number ${String(value)}${at(span)} is not finite: use a finite number`, span);
      }
      const word = String(value);
      const span = locateIdentifier(source, word, 'symbol');
      return located(`'${word}'${at(span)} is not a number: ${ALLOWED_SYNTAX}`, span);
    }
    case 'operator': {
      const { op, fn } = unsupported;
      const span = locateOperator(source, op);
      const what = OPERATOR_KIND[fn] ?? `the operator '${op}'`;
      return located(`Unsupported syntax${at(span)}: ${what} cannot be used in a potential; ${ALLOWED_SYNTAX}`, span);
    }
    case 'node': {
      const entry = SYNTAX_BY_NODE[unsupported.type];
      const span = entry?.find(source);
      const what = entry?.what ?? `${unsupported.type} expressions`;
      return located(`Unsupported syntax${at(span)}: ${what} cannot be used in a potential; ${ALLOWED_SYNTAX}`, span);
    }
  }
}

// The first ; or line break with an expression on both sides, so a leading blank line is skipped.
function locateSeparator(source: string): SourceSpan | undefined {
  for (let i = 0; i < source.length; i++) {
    const ch = source[i];
    if ((ch === ';' || ch === '\n') && source.slice(0, i).trim() !== '' && source.slice(i + 1).trim() !== '') {
      return { index: i, length: 1 };
    }
  }
  return undefined;
}

function locateNonFinite(source: string, value: number): SourceSpan | undefined {
  const word = Number.isNaN(value) ? 'NaN' : 'Infinity';
  const named = locateIdentifier(source, word, 'symbol');
  if (named) return named;
  // A literal too large for a double, e.g. 1e999, also parses to Infinity.
  const literal = /(?<![\p{L}\p{N}_$.])(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/gu;
  for (let match = literal.exec(source); match; match = literal.exec(source)) {
    if (!Number.isFinite(Number(match[0]))) return { index: match.index, length: match[0].length };
  }
  return undefined;
}

function derivativeProblem(
  order: 1 | 2 | 3,
  failure: DerivativeFailure,
  source: string,
  declared: readonly string[],
): ExpressionProblem {
  const which = ['', 'first', 'second', 'third'][order];
  switch (failure.reason) {
    case 'threw':
      return { message: `The expression is not differentiable: its ${which} derivative failed (${failure.message})` };
    case 'too-large':
      return {
        message: `The expression is too complex: its ${which} derivative has ${failure.nodes} parts (at most ${MAX_DERIVATIVE_NODES}); write it more compactly`,
      };
    case 'too-deep':
      return tooDeep();
    case 'unsupported': {
      const inner = unsupportedProblem(failure.unsupported, source, declared);
      return { message: `The expression is not differentiable within the supported functions: its ${which} derivative needs something unsupported (${inner.message})` };
    }
  }
}

/** " (did you mean 'lambda'?)" when one candidate is a near miss of `name`, else "". */
function suggestion(name: string, candidates: readonly string[]): string {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    const d = editDistance(name.toLowerCase(), candidate.toLowerCase());
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  const allowed = Math.max(1, Math.floor(name.length / 3));
  return best !== undefined && bestDistance <= allowed ? ` (did you mean '${best}'?)` : '';
}

// Levenshtein distance by the two-row dynamic programme.
function editDistance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + cost);
    }
    previous = current;
  }
  return previous[b.length];
}
