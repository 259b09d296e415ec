#!/usr/bin/env node
// Adaptive refinement against a uniform grid: the α-attractor T-model (n = 1, slow roll) over
// log α from 0.1 to 100 × N_* from 45 to 65, boundary the 95 % region of planck18-bk18
// (Δχ² = 6.18). Truth: for each N_* of a fine list, every α where Δχ² crosses 6.18, bracketed on
// a log α list and found by bisection with the engine directly. Each mesh's boundary at that N_*
// is where the field, interpolated inside the leaf cells the line N_* passes through (bilinear in
// log α and N_*), changes sign (`crossingsAlong`). Printed: points, and max and RMS of |Δ log10 α|.
// Figures only. Run after building shared: `node shared/bench/refinement.bench.mjs`.
import { boundaryDistance, boundaryLevel, crossingsAlong, deltaChi2, findLikelihoodSet, meshEvidence, RefinementLattice, RefinementMesh, refineInProcess, RequestEvaluator } from '@sixtyfold/shared';

const set = findLikelihoodSet('planck18-bk18');
const boundary = { kind: 'likelihood', likelihood: 'planck18-bk18', level: 95 };
const threshold = boundaryLevel(boundary);
const engine = new RequestEvaluator();
let evaluations = 0;
/** Δχ² at (α, N_*), null for a failed point. */
function chi2([alpha, nStar]) {
  evaluations++;
  const result = engine.evaluate({ potential: 'alpha-t', params: { V0: 1e-10, n: 1, alpha }, nStar, method: 'slowroll' });
  return result.status === 'ok' ? (deltaChi2(set, { ns: result.ns, r: result.r, alphaS: result.alphaS })?.deltaChi2 ?? null) : null;
}
const axes = [
  { kind: 'range', parameter: 'alpha', min: 0.1, max: 100, count: 0, spacing: 'log' },
  { kind: 'range', parameter: 'nStar', min: 45, max: 65, count: 0, spacing: 'linear' },
];
const withCount = (count) => axes.map((axis) => ({ ...axis, count }));

// Truth.
const truthStart = performance.now();
const nStars = Array.from({ length: 81 }, (_, k) => 45 + (20 * k) / 80);
const bracket = Array.from({ length: 121 }, (_, i) => -1 + (3 * i) / 120); // log10 α
const truth = nStars.map((nStar) => {
  const crossings = [];
  const f = (lg) => (chi2([10 ** lg, nStar]) ?? Number.NaN) - threshold;
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
const truthCount = truth.reduce((n, t) => n + t.crossings.length, 0);
console.log(`Truth: ${truthCount} crossings of Δχ² = ${threshold.toFixed(3)} at ${nStars.length} values of N_* (45–65), by bisection to 1e-12 in log10 α (${evaluations} engine calls, ${((performance.now() - truthStart) / 1000).toFixed(1)} s)`);

function boundaryError(mesh, values) {
  const errors = [];
  let missing = 0;
  for (const { nStar, crossings } of truth) {
    const found = crossingsAlong(mesh, (key) => boundaryDistance(boundary, values.get(key) ?? null), nStar).map(Math.log10);
    for (const x of crossings) {
      if (found.length === 0) {
        missing++;
        continue;
      }
      errors.push(Math.min(...found.map((y) => Math.abs(y - x))));
    }
  }
  const max = Math.max(...errors);
  const rms = Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length);
  return { max, rms, missing };
}

function run(label, count, factors, depth) {
  evaluations = 0;
  const start = performance.now();
  const lattice = new RefinementLattice(withCount(count), factors, Math.max(depth, 1));
  const refinement = depth === 0 ? null : refineInProcess(lattice, chi2, (d) => boundaryDistance(boundary, d));
  const outcome = refinement ?? uniform(lattice);
  const seconds = (performance.now() - start) / 1000;
  const error = boundaryError(outcome.mesh, outcome.values);
  const evidence = meshEvidence(outcome.mesh, outcome.values);
  return { label, points: evaluations, seconds, levels: outcome.pointsPerLevel, ...error, lnZ: evidence.lnZ };
}

/** The parent grid alone: a lattice whose refinement never starts. */
function uniform(lattice) {
  const { values, pointsPerLevel } = refineInProcess(lattice, chi2, () => 1);
  return { mesh: new RefinementMesh(lattice, []), values, pointsPerLevel };
}

const results = [run('uniform 256 × 256', 256, [2, 2], 0), run('uniform 33 × 33 (the refinement\'s parent)', 33, [2, 2], 0), run('refined: 33 × 33, factor 2, depth 3', 33, [2, 2], 3), run('refined: 33 × 33, factor 2, depth 4', 33, [2, 2], 4), run('refined: 17 × 17, factor 2, depth 4', 17, [2, 2], 4), run('refined: 33 × 33, factor 4, depth 2', 33, [4, 4], 2)];
const base = results[0];
console.log('');
for (const r of results) {
  const share = ((100 * r.points) / base.points).toFixed(1);
  console.log(
    `${r.label}: ${r.points.toLocaleString('en-US')} points (${share} % of the uniform 256 × 256; per level ${r.levels.join(' + ')}), ${r.seconds.toFixed(1)} s; ` +
      `boundary error |Δ log10 α| max ${r.max.toExponential(2)}, RMS ${r.rms.toExponential(2)}${r.missing ? `, ${r.missing} crossings not found` : ''}; ln Z ${r.lnZ.toFixed(4)}`,
  );
}
// The goal: the boundary located as precisely as by the uniform 256 × 256 grid (max and RMS of the
// error no larger), with at most 15 % of its points.
console.log('');
for (const r of results.slice(2)) {
  const met = r.max <= base.max && r.rms <= base.rms && r.points <= 0.15 * base.points;
  console.log(`goal (error ≤ uniform 256 × 256's, ≤ 15 % of its points) for ${r.label}: ${met ? 'met' : 'not met'} (max ${(r.max / base.max).toFixed(2)}×, RMS ${(r.rms / base.rms).toFixed(2)}×, ${((100 * r.points) / base.points).toFixed(1)} % of the points)`);
}
