import { POINT_OUTPUTS } from '../schemas/scan-point.schema.js';
import type { ReproducedPoint, ReproductionOutput, ReproductionReport } from '../schemas/scan-reproduction.schema.js';

/** |a − b| / max(|a|, |b|): 0 for equal values, at most 2, symmetric, and defined at 0 unless both are 0. */
export function relativeDifference(a: number, b: number): number {
  if (a === b) return 0;
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));
}

/**
 * Stored points against the same points recomputed, per output: identical means the same double to
 * the last bit (`Object.is`, so 0 and −0 differ); otherwise the largest relative difference and the
 * first point where it occurs. Points are matched by index; one missing from either side is skipped.
 */
export function compareReproduction(stored: ReproducedPoint[], recomputed: ReproducedPoint[]): ReproductionReport {
  const again = new Map(recomputed.map((p) => [p.pointIndex, p]));
  const pairs = stored.flatMap((s) => (again.has(s.pointIndex) ? [[s, again.get(s.pointIndex)!] as const] : []));
  const outputs = POINT_OUTPUTS.map((output): ReproductionOutput => {
    let differing = 0;
    let maxRelativeDifference: number | null = null;
    let atPointIndex: number | null = null;
    for (const [s, r] of pairs) {
      const a = s[output];
      const b = r[output];
      if (Object.is(a, b)) continue;
      differing++;
      if (a === null || b === null) {
        atPointIndex ??= s.pointIndex;
        continue;
      }
      const difference = relativeDifference(a, b);
      if (maxRelativeDifference === null || difference > maxRelativeDifference) {
        maxRelativeDifference = difference;
        atPointIndex = s.pointIndex;
      }
    }
    return { output, compared: pairs.length, identical: differing === 0, differing, maxRelativeDifference, atPointIndex };
  });
  const statusChanges = pairs.filter(([s, r]) => s.status !== r.status).map(([s, r]) => ({ pointIndex: s.pointIndex, stored: s.status, recomputed: r.status }));
  return { identical: statusChanges.length === 0 && outputs.every((o) => o.identical), outputs, statusChanges };
}
