/** A stretch of the source text: 0-based start and length in UTF-16 code units. */
export interface SourceSpan {
  index: number;
  length: number;
}

// mathjs identifiers are letters (any script), digits, _ and $; a match must not touch one of these.
const IDENTIFIER_CHAR = /[\p{L}\p{N}_$]/u;

function isIdentifierChar(ch: string | undefined): boolean {
  return ch !== undefined && IDENTIFIER_CHAR.test(ch);
}

function nextNonSpace(source: string, from: number): string | undefined {
  for (let i = from; i < source.length; i++) {
    const ch = source[i];
    if (ch !== ' ' && ch !== '\t') return ch;
  }
  return undefined;
}

/** Every start index of `word` in `source` that stands as a whole identifier. */
function wholeWordMatches(source: string, word: string): number[] {
  const found: number[] = [];
  if (word.length === 0) return found;
  for (let i = source.indexOf(word); i >= 0; i = source.indexOf(word, i + 1)) {
    if (!isIdentifierChar(source[i - 1]) && !isIdentifierChar(source[i + word.length])) found.push(i);
  }
  return found;
}

/**
 * Where an identifier first occurs as a whole word. mathjs trees carry no positions, so this
 * searches the text: a function is preferably an occurrence followed by `(`, a symbol one that is
 * not, and either falls back to the first whole-word occurrence.
 */
export function locateIdentifier(source: string, name: string, as: 'symbol' | 'function'): SourceSpan | undefined {
  const matches = wholeWordMatches(source, name);
  if (matches.length === 0) return undefined;
  const preferred = matches.find((i) => (nextNonSpace(source, i + name.length) === '(') === (as === 'function'));
  return { index: preferred ?? matches[0], length: name.length };
}

// Operator texts that are a prefix of a longer operator: `<` of `<=`, `!` of `!=`, and so on.
const LONGER_OPERATORS = ['==', '!=', '<=', '>=', '<<', '>>', '>>>', '??', '^|', '.*', './', '.^'];

/**
 * Where an operator's text first occurs. Word operators (`mod`, `and`, `to`...) must stand as whole
 * words; symbol operators must not be the start or end of a longer operator.
 */
export function locateOperator(source: string, op: string): SourceSpan | undefined {
  if (/^[A-Za-z]+$/.test(op)) {
    const [first] = wholeWordMatches(source, op);
    return first === undefined ? undefined : { index: first, length: op.length };
  }
  for (let i = source.indexOf(op); i >= 0; i = source.indexOf(op, i + 1)) {
    if (!insideLongerOperator(source, op, i)) return { index: i, length: op.length };
  }
  return undefined;
}

function insideLongerOperator(source: string, op: string, at: number): boolean {
  for (const longer of LONGER_OPERATORS) {
    if (longer.length <= op.length || !longer.includes(op)) continue;
    for (let shift = 0; shift <= longer.length - op.length; shift++) {
      if (at - shift >= 0 && source.startsWith(longer, at - shift)) return true;
    }
  }
  return false;
}

/** The first match of `pattern` (a global-free RegExp), as a span; `group` picks a capture. */
export function locatePattern(source: string, pattern: RegExp, group = 0): SourceSpan | undefined {
  const match = pattern.exec(source);
  if (!match) return undefined;
  const text = match[group];
  if (text === undefined) return undefined;
  const offset = group === 0 ? 0 : match[0].indexOf(text);
  return { index: match.index + offset, length: text.length };
}
