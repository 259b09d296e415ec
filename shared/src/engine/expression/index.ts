export {
  MAX_POTENTIAL_LENGTH,
  parameterNameProblem,
  parsePotential,
  type CompiledPotential,
  type ExpressionProblem,
  type ParsedPotential,
  type PotentialBindResult,
  type PotentialParseResult,
} from './compile-potential.js';
export { POTENTIAL_FUNCTIONS, type PotentialFunctionName } from './expression-tree.js';
export { detectScale, type PotentialScale } from './detect-scale.js';
