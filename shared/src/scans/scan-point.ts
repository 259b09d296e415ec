import type { EvaluateRequest } from '../schemas/evaluate.schema.js';
import { PIVOT_AXES, type CreateScan } from '../schemas/scan.schema.js';

/**
 * The engine request for one scan point: the fixed parameters with this point's axis values
 * on top, and N_* (or the reheating history) from the pivot or from the axes.
 * `potential` is a built-in family key or the group model's expression.
 */
export function pointRequest(spec: CreateScan, potential: string, axisValues: Record<string, number>): EvaluateRequest {
  const params: Record<string, number> = { ...spec.params };
  for (const [name, value] of Object.entries(axisValues)) {
    if (!(PIVOT_AXES as readonly string[]).includes(name)) params[name] = value;
  }
  const base = { potential, params, phiInit: spec.phiInit, method: spec.method, tolerance: spec.tolerance };
  if (spec.pivot.kind === 'fixed') return { ...base, nStar: axisValues.nStar ?? spec.pivot.nStar };
  return {
    ...base,
    reheating: { w: axisValues.reheatingW ?? (spec.pivot.w as number), energyGeV: axisValues.reheatingEnergyGeV ?? spec.pivot.energyGeV },
  };
}
