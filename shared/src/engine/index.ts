export * from './types.js';
export * from './constants.js';
export { DEFAULT_POINT_BUDGET, type EngineOptions, type PointBudget } from './budget.js';
export { PointEvaluator, type Method, type PointOutcome, type PointResult, type PointSpec } from './evaluate-point.js';
export { RequestEvaluator, type EvaluateResponse } from './evaluate-request.js';
export { POTENTIAL_FAMILIES, findFamily, type PotentialFamily } from './families/potential-families.js';
export { nStarFromReheating, type Reheating } from './pivot/reheating.js';
export * from './expression/index.js';
export { resolvedEngineOptions, type ResolvedEngineOptions } from './resolved-options.js';
