import { parsePotential, type CompiledPotential } from '../../src/engine/expression/index.js';

/** Parses and binds an expression for a test, failing loudly if either step refuses it. */
export function compile(source: string, params: Record<string, number>): CompiledPotential {
  const parsed = parsePotential(source, Object.keys(params));
  if (!parsed.ok) throw new Error(`parse failed: ${parsed.problem.message}`);
  const bound = parsed.potential.bind(params);
  if (!bound.ok) throw new Error(`bind failed: ${bound.problem.message}`);
  return bound.potential;
}
