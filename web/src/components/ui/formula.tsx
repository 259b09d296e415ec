import { Box, type BoxProps } from '@chakra-ui/react';
import type katexModule from 'katex';
import { create, parseDependencies, type MathNode } from 'mathjs/number';
import { useEffect, useMemo, useState } from 'react';

// Parsing only: the formula is typeset from the parse tree and never evaluated here.
const math = create({ parseDependencies }, {});

const GREEK = new Set([
  'alpha', 'beta', 'gamma', 'delta', 'epsilon', 'zeta', 'eta', 'theta', 'iota', 'kappa', 'lambda', 'mu', 'nu', 'xi',
  'pi', 'rho', 'sigma', 'tau', 'upsilon', 'phi', 'chi', 'psi', 'omega',
  'Gamma', 'Delta', 'Theta', 'Lambda', 'Xi', 'Pi', 'Sigma', 'Upsilon', 'Phi', 'Psi', 'Omega',
]);

function wordTex(word: string): string {
  if (GREEK.has(word)) return `\\${word}`;
  if (/^\d+$/.test(word) || word.length === 1) return word;
  return `\\mathrm{${word}}`;
}

/** lambda → λ, V0 → V₀, phi_end → φ_end, Lambda4 → Λ₄: names as they are written on paper. */
export function symbolTex(name: string): string {
  const underscore = name.indexOf('_');
  const [base, sub] =
    underscore > 0 ? [name.slice(0, underscore), name.slice(underscore + 1)] : (/^([A-Za-z]+?)(\d+)$/.exec(name)?.slice(1) ?? [name, '']);
  const baseTex = GREEK.has(base) || base.length === 1 ? wordTex(base) : `\\mathit{${base}}`;
  return sub ? `${baseTex}_{${sub.split('_').map(wordTex).join(',')}}` : baseTex;
}

// Six significant digits keep derivative constants such as 0.816496580927726 readable.
function numberTex(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const [mantissa, exponent] = Number(value.toPrecision(6)).toExponential().split('e');
  const power = Number(exponent);
  if (power >= -3 && power < 6) return String(Number(value.toPrecision(6)));
  return `${mantissa === '1' ? '' : `${mantissa}\\times `}10^{${power}}`;
}

function handler(node: MathNode, options: object): string | undefined {
  if (node.type === 'SymbolNode') return symbolTex((node as unknown as { name: string }).name);
  if (node.type === 'ConstantNode') {
    const value = (node as unknown as { value: unknown }).value;
    return typeof value === 'number' ? numberTex(value) : undefined;
  }
  if (node.type === 'FunctionNode') {
    const { fn, args } = node as unknown as { fn: { name?: string }; args: MathNode[] };
    if (fn.name === 'exp' && args.length === 1) return `e^{${args[0].toTex(options)}}`;
  }
  return undefined;
}

/**
 * TeX for a potential written in the engine's syntax (mathjs), with Greek and subscripted names,
 * e^{x} for exp(x) and a thin space for products except before a number, where × would be lost.
 * Throws when the text does not parse; callers show the source instead.
 */
export function expressionToTex(expression: string): string {
  const tex = math.parse(expression).toTex({ parenthesis: 'auto', implicit: 'hide', handler });
  return tex.replace(/\\cdot(?!\s*\{?\s*[0-9.])/g, '\\,');
}

type Katex = typeof katexModule;

// KaTeX and its stylesheet are a quarter of a megabyte, so they load with the first formula
// shown, not with the app; until then a formula shows its source text.
let katex: Katex | null = null;
let loading: Promise<Katex> | null = null;
function loadKatex(): Promise<Katex> {
  loading ??= Promise.all([import('katex'), import('katex/dist/katex.min.css')]).then(([module]) => (katex = module.default));
  return loading;
}

interface FormulaProps extends Omit<BoxProps, 'children'> {
  /** The expression in the engine's syntax. */
  expression: string;
  /** TeX placed before the expression, e.g. `V(\phi) =`. */
  lhs?: string;
  /** Block layout, larger; inline otherwise. */
  block?: boolean;
}

/** A potential typeset with KaTeX; screen readers get KaTeX's MathML, and the source text before KaTeX loads or if it fails. */
export function Formula({ expression, lhs, block = false, ...boxProps }: FormulaProps) {
  const [typesetter, setTypesetter] = useState(katex);
  useEffect(() => {
    if (typesetter) return;
    let current = true;
    loadKatex().then(
      (loaded) => current && setTypesetter(() => loaded),
      () => undefined, // offline or a failed chunk: the source text stays, which is still correct
    );
    return () => {
      current = false;
    };
  }, [typesetter]);

  const html = useMemo(() => {
    if (!typesetter) return null;
    try {
      const tex = `${lhs ? `${lhs} ` : ''}${expressionToTex(expression)}`;
      return typesetter.renderToString(tex, { displayMode: block, throwOnError: true, output: 'htmlAndMathml' });
    } catch {
      return null;
    }
  }, [typesetter, expression, lhs, block]);

  if (html === null) {
    return (
      <Box as="code" fontFamily="mono" fontSize="sm" wordBreak="break-word" {...boxProps}>
        {expression}
      </Box>
    );
  }
  return (
    <Box
      as={block ? 'div' : 'span'}
      color="ink.900"
      maxW="full"
      overflowX="auto"
      overflowY="hidden"
      css={{ '& .katex': { fontSize: block ? '1.2em' : '1.05em' }, '& .katex-display': { margin: 0 } }}
      {...boxProps}
      dangerouslySetInnerHTML={{ __html: html }}
    />
  );
}
