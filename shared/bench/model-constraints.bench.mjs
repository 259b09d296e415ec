#!/usr/bin/env node
// Constraints and evidence of two small grid scans, computed by the engine (slow roll, first
// order) and judged by every built-in likelihood set: the α-attractor T-model (n = 1) over
// log α × N_* and φ^p over p × N_*. Figures only; r is taken at the scan's pivot for every set.
// Run after building shared: `node shared/bench/model-constraints.bench.mjs`.
import { BUILT_IN_LIKELIHOOD_SETS, RequestEvaluator, bayesFactor, deltaChi2, gridEvidence, gridPosterior } from '@sixtyfold/shared';

const engine = new RequestEvaluator();
const linear = (name, min, max, count) => ({ name, spacing: 'linear', values: Array.from({ length: count }, (_, i) => min + ((max - min) * i) / (count - 1)) });
const logSpaced = (name, min, max, count) => ({ name, spacing: 'log', values: Array.from({ length: count }, (_, i) => min * (max / min) ** (i / (count - 1))) });

function scan(label, potential, fixed, axes) {
  const [a, b] = axes;
  const points = [];
  const start = performance.now();
  for (const x of a.values) {
    for (const nStar of b.values) {
      const result = engine.evaluate({ potential, params: { ...fixed, [a.name]: x }, nStar, method: 'slowroll' });
      points.push(result.status === 'ok' ? result : null);
    }
  }
  console.log(`${label}: ${points.length} points in ${((performance.now() - start) / 1000).toFixed(1)} s, ${points.filter((p) => !p).length} failed`);
  return { label, axes, points };
}

const scans = [
  scan('α-attractor T-model (n = 1), α 0.01–100 (log) × N_* 50–60', 'alpha-t', { V0: 1e-10, n: 1 }, [logSpaced('alpha', 0.01, 100, 41), linear('nStar', 50, 60, 11)]),
  scan('φ^p, p 0.5–4 × N_* 50–60', 'monomial', { lambda: 1e-10 }, [linear('p', 0.5, 4, 36), linear('nStar', 50, 60, 11)]),
];

const format = (x) => Number(x.toPrecision(4));
for (const set of BUILT_IN_LIKELIHOOD_SETS) {
  console.log(`\n${set.name} (${set.key} v${set.version})`);
  const evidences = [];
  for (const { label, axes, points } of scans) {
    const chi2 = points.map((p) => (p ? deltaChi2(set, { ns: p.ns, r: p.r, alphaS: p.alphaS })?.deltaChi2 ?? null : null));
    const posterior = gridPosterior({ axes, deltaChi2: chi2 });
    const evidence = gridEvidence({ axes, deltaChi2: chi2 });
    evidences.push(evidence);
    console.log(`  ${label}`);
    console.log(`    best fit ${JSON.stringify(Object.fromEntries(Object.entries(posterior.bestFit.point).map(([k, v]) => [k, format(v)])))} Δχ² = ${format(posterior.bestFit.deltaChi2)}`);
    for (const c of posterior.constraints) {
      const text = c.intervals.map((i) => `${Math.round(i.level * 100)}% ${i.kind} [${format(i.lower)}, ${format(i.upper)}]`).join('; ');
      console.log(`    ${c.axis}: ${text}${c.edgeWarning ? ` (${c.edgeWarning})` : ''}`);
    }
    console.log(`    ln Z = ${evidence.lnZ.toFixed(3)} ± ${evidence.lnZError.toExponential(1)} (half resolution)`);
  }
  const factor = bayesFactor(evidences[0].lnZ, evidences[1].lnZ);
  console.log(`  ln B (T-model vs φ^p) = ${factor.lnB.toFixed(2)}, 2 ln B = ${factor.twoLnB.toFixed(2)}: ${factor.words.replace('model', 'T-model').replace('reference', 'φ^p')}`);
}
