#!/usr/bin/env node
// Posterior and evidence of a 1,000 × 1,000 grid (a million points, a few failed), and the
// analytic fixtures' numerical errors. Figures only.
// Run after building shared: `node shared/bench/grid-posterior.bench.mjs`.
import { gridEvidence, gridPosterior, SIGMA_CONFIDENCE_LEVELS } from '@sixtyfold/shared';

const linear = (name, min, max, count) => ({ name, values: Array.from({ length: count }, (_, i) => min + ((max - min) * i) / (count - 1)) });
const logSpaced = (name, min, max, count) => ({ name, spacing: 'log', values: Array.from({ length: count }, (_, i) => min * (max / min) ** (i / (count - 1))) });

function gaussianGrid(x, y, f) {
  const chi2 = new Float64Array(x.values.length * y.values.length);
  x.values.forEach((xv, i) => y.values.forEach((yv, j) => (chi2[i * y.values.length + j] = f(xv, yv))));
  return chi2;
}

function time(label, run, repeat = 5) {
  run();
  const times = [];
  for (let k = 0; k < repeat; k++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  console.log(`${label}: median ${times[Math.floor(repeat / 2)].toFixed(1)} ms, best ${times[0].toFixed(1)} ms (${repeat} runs)`);
}

const alpha = logSpaced('alpha', 0.01, 100, 1000);
const nStar = linear('nStar', 50, 60, 1000);
const chi2 = gaussianGrid(alpha, nStar, (a, n) => (Math.log10(a) / 0.7) ** 2 + ((n - 55) / 2) ** 2);
for (let p = 0; p < chi2.length; p += 997) chi2[p] = Number.NaN; // failed points
const million = { axes: [alpha, nStar], deltaChi2: chi2 };
console.log('Grid posterior bench: 1,000 × 1,000 points (log α × linear N_*), 1 in 997 failed');
time('gridPosterior (marginals, 2-D marginal, intervals, best fit)', () => gridPosterior(million));
time('gridEvidence (full and half resolution)', () => gridEvidence(million));

console.log('\nAnalytic fixtures');
const sx = 0.01, sy = 0.02;
for (const count of [50, 100, 200, 400]) {
  const x = linear('x', -0.1, 0.1, count);
  const y = linear('y', -0.15, 0.15, count);
  const evidence = gridEvidence({ axes: [x, y], deltaChi2: gaussianGrid(x, y, (a, b) => (a / sx) ** 2 + (b / sy) ** 2) });
  const exact = (2 * Math.PI * sx * sy) / (0.2 * 0.3);
  console.log(`  2-D Gaussian Z = 2πσxσy/A at ${count} × ${count}: relative error ${(evidence.z / exact - 1).toExponential(2)}, ` +
    `half-resolution estimate of the ln Z error ${evidence.lnZError.toExponential(2)}`);
}
for (const count of [51, 201, 801]) {
  const x = linear('x', -10, 10, count);
  const [one, two] = gridPosterior({ axes: [x], deltaChi2: x.values.map((v) => v * v) }, { levels: SIGMA_CONFIDENCE_LEVELS.slice(0, 2) }).constraints[0].intervals;
  console.log(`  1-D Gaussian, spacing ${(20 / (count - 1)).toFixed(3)}: 68.3% interval [${one.lower.toFixed(5)}, ${one.upper.toFixed(5)}], ` +
    `95.4% [${two.lower.toFixed(5)}, ${two.upper.toFixed(5)}] (exact ±1, ±2)`);
}
const a = gridEvidence({ axes: [linear('x', 0, 1, 11)], deltaChi2: new Float64Array(11) });
const b = gridEvidence({ axes: [linear('p', 1, 6, 7), linear('n', 50, 60, 3)], deltaChi2: new Float64Array(21) });
console.log(`  flat likelihood: ln B between two scans = ${(a.lnZ - b.lnZ).toExponential(2)} (exact 0)`);
