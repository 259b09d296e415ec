#!/usr/bin/env node
// Adaptive refinement against a uniform grid: the α-attractor T-model (n = 1, slow roll) over
// log α from 0.1 to 100 × N_* from 45 to 65, boundary the 95 % region of planck18-bk18
// (Δχ² = 6.18). Truth: for each N_* of a fine list, every α where Δχ² crosses 6.18, bracketed on
// a log α list and found by bisection with the engine directly. Each mesh's boundary at that N_*
// is where the field, interpolated inside the leaf cells the line N_* passes through (bilinear in
// log α and N_*), changes sign (`crossingsAlong`). Printed: points, and max and RMS of |Δ log10 α|.
// Figures only. Run after building shared: `node shared/bench/refinement.bench.mjs`.
import { boundaryDistance, meshEvidence, RefinementLattice, RefinementMesh, refineInProcess } from '@sixtyfold/shared';
import { axesWithCount, boundary, boundaryError, threshold, tModelTruth } from './lib/t-model-boundary.mjs';

const truthStart = performance.now();
const { truth, calls, chi2: engineChi2 } = tModelTruth();
const truthCount = truth.reduce((n, t) => n + t.crossings.length, 0);
console.log(`Truth: ${truthCount} crossings of Δχ² = ${threshold.toFixed(3)} at ${truth.length} values of N_* (45–65), by bisection to 1e-12 in log10 α (${calls} engine calls, ${((performance.now() - truthStart) / 1000).toFixed(1)} s)`);

let evaluations = 0;
/** Δχ² at (α, N_*), null for a failed point. */
function chi2([alpha, nStar]) {
  evaluations++;
  return engineChi2(alpha, nStar);
}

function run(label, count, factors, depth) {
  evaluations = 0;
  const start = performance.now();
  const lattice = new RefinementLattice(axesWithCount(count), factors, Math.max(depth, 1));
  const refinement = depth === 0 ? null : refineInProcess(lattice, chi2, (d) => boundaryDistance(boundary, d));
  const outcome = refinement ?? uniform(lattice);
  const seconds = (performance.now() - start) / 1000;
  const error = boundaryError(truth, outcome.mesh, outcome.values);
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
