#!/usr/bin/env node
// The most any built-in family spends per point over its parameter region (each parameter at its
// minimum, default and maximum, every combination; N_* = 50 and 60; exact method with the
// spectrum, the dearest request), against the default per-point budgets. Figures only.
// Run after building shared: `node shared/bench/budget-use.bench.mjs`.
import { DEFAULT_POINT_BUDGET, POTENTIAL_FAMILIES, RequestEvaluator } from '@sixtyfold/shared';

const engine = new RequestEvaluator({ now: () => performance.now() });

function combinations(parameters) {
  let rows = [{}];
  for (const p of parameters) {
    const values = [...new Set([p.min, p.defaultValue, p.max])];
    rows = rows.flatMap((row) => values.map((value) => ({ ...row, [p.name]: value })));
  }
  return rows;
}

const table = [];
for (const family of POTENTIAL_FAMILIES) {
  const most = { evaluations: 0, steps: 0, ms: 0, points: 0, statuses: {}, at: '' };
  for (const params of combinations(family.parameters)) {
    for (const nStar of [50, 60]) {
      const start = performance.now();
      const result = engine.evaluate({ potential: family.key, params, nStar, method: 'exact', spectrum: true, trajectory: true });
      const ms = performance.now() - start;
      most.points++;
      most.statuses[result.status] = (most.statuses[result.status] ?? 0) + 1;
      most.ms = Math.max(most.ms, ms);
      if ((result.evaluations ?? 0) > most.evaluations) {
        most.evaluations = result.evaluations;
        most.at = `${Object.entries(params).map(([name, value]) => `${name}=${value}`).join(' ')} N*=${nStar}`;
      }
      most.steps = Math.max(most.steps, result.trajectory?.N.length ?? 0);
    }
  }
  table.push({
    family: family.key,
    points: most.points,
    'max evaluations': most.evaluations,
    'max stored steps': most.steps,
    'max ms': Math.round(most.ms),
    'dearest point': most.at,
    statuses: Object.entries(most.statuses).map(([s, n]) => `${s} ${n}`).join(', '),
  });
}
console.table(table);
console.log('default budget:', DEFAULT_POINT_BUDGET);
