import { parsePotential, type PotentialParseResult } from '@sixtyfold/shared';

// Parsing differentiates three times and can take a second for the α-attractors, so each
// expression is parsed once per session: revisiting a page or retyping a name costs nothing.
const cache = new Map<string, PotentialParseResult>();
const LIMIT = 64;

/** parsePotential, remembered for the last 64 expressions and parameter lists. */
export function parsePotentialOnce(expression: string, parameterNames: readonly string[]): PotentialParseResult {
  const key = `${parameterNames.join(',')}|${expression}`;
  let result = cache.get(key);
  if (!result) {
    result = parsePotential(expression, parameterNames);
    if (cache.size >= LIMIT) cache.delete(cache.keys().next().value as string);
    cache.set(key, result);
  }
  return result;
}
