// The refinement benchmark's problem, shared by the in-process part (shared/bench/refinement.bench.mjs)
// and the one through the API (deploy/scripts/lib/refine-bench.mjs): the α-attractor T-model (n = 1,
// slow roll) over log α from 0.1 to 100 × N_* from 45 to 65, boundary the 95 % region of planck18-bk18.
import { boundaryDistance, boundaryLevel, crossingsAlong, deltaChi2, findLikelihoodSet, RequestEvaluator } from '@sixtyfold/shared';

export const set = findLikelihoodSet('planck18-bk18');
export const boundary = { kind: 'likelihood', likelihood: 'planck18-bk18', level: 95 };
export const threshold = boundaryLevel(boundary);
export const axesWithCount = (count) => [
  { kind: 'range', parameter: 'alpha', min: 0.1, max: 100, count, spacing: 'log' },
  { kind: 'range', parameter: 'nStar', min: 45, max: 65, count, spacing: 'linear' },
];

/** Δχ² of stored or computed outputs under the set; null without n_s or r. */
export const chi2Of = (point) => (point && Number.isFinite(point.ns) && Number.isFinite(point.r) ? (deltaChi2(set, { ns: point.ns, r: point.r, alphaS: point.alphaS })?.deltaChi2 ?? null) : null);

/**
 * Truth: for each N_* of a fine list (81 values), every α where Δχ² crosses the threshold,
 * bracketed on a list of log α and found by bisection to 1e-12 in log10 α, with the engine directly.
 */
export function tModelTruth() {
  const engine = new RequestEvaluator();
  let calls = 0;
  const chi2 = (alpha, nStar) => {
    calls++;
    const result = engine.evaluate({ potential: 'alpha-t', params: { V0: 1e-10, n: 1, alpha }, nStar, method: 'slowroll' });
    return result.status === 'ok' ? chi2Of(result) : null;
  };
  const nStars = Array.from({ length: 81 }, (_, k) => 45 + (20 * k) / 80);
  const bracket = Array.from({ length: 121 }, (_, i) => -1 + (3 * i) / 120);
  const truth = nStars.map((nStar) => {
    const crossings = [];
    const f = (lg) => (chi2(10 ** lg, nStar) ?? Number.NaN) - threshold;
    let previous = f(bracket[0]);
    for (let i = 1; i < bracket.length; i++) {
      const value = f(bracket[i]);
      if (previous < 0 !== value < 0 && Number.isFinite(previous) && Number.isFinite(value)) {
        let lo = bracket[i - 1];
        let hi = bracket[i];
        let flo = previous;
        for (let k = 0; k < 45; k++) {
          const mid = (lo + hi) / 2;
          const fm = f(mid);
          if (fm < 0 === flo < 0) [lo, flo] = [mid, fm];
          else hi = mid;
        }
        crossings.push((lo + hi) / 2);
      }
      previous = value;
    }
    return { nStar, crossings };
  });
  return { truth, calls, chi2 };
}

/** Max and RMS of |Δ log10 α| between the truth and a mesh's crossings (`crossingsAlong`), and truth crossings with none found. */
export function boundaryError(truth, mesh, chi2ByKey) {
  const errors = [];
  let missing = 0;
  for (const { nStar, crossings } of truth) {
    const found = crossingsAlong(mesh, (key) => boundaryDistance(boundary, chi2ByKey.get(key) ?? null), nStar).map(Math.log10);
    for (const x of crossings) {
      if (found.length === 0) missing++;
      else errors.push(Math.min(...found.map((y) => Math.abs(y - x))));
    }
  }
  return { max: Math.max(...errors), rms: Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length), missing };
}
