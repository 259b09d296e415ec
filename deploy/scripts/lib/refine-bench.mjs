// `npm run bench -- refine`, through the API: the refinement benchmark's T-model problem
// (shared/bench/lib/t-model-boundary.mjs) computed the way a group would: a uniform 256 × 256 grid
// scan, and a 33 × 33 grid refined at the 95 % boundary of planck18-bk18 (factor 2, depth 4) by
// follow-up scans the API chains as each level completes, all on the same workers. Printed: points,
// wall time from submission to the last level's finish, and the boundary error against the truth.
// Figures only; the tests assert the behaviour.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { call, completed, sleep } from './api-calls.mjs';
import { ROOT } from './environment.mjs';

/** Every stored point of a scan, page by page. */
async function allPoints(load, route) {
  const items = [];
  for (let page = 1; ; page++) {
    const body = await call(load, `${route}${route.includes('?') ? '&' : '?'}page=${page}&pageSize=500`);
    items.push(...body.items);
    if (items.length >= body.total || body.items.length === 0) return items;
  }
}

export async function benchRefine(load, { reconcileSeconds }) {
  const shared = await import('@sixtyfold/shared');
  const { axesWithCount, boundary, boundaryError, chi2Of, tModelTruth } = await import(pathToFileURL(path.join(ROOT, 'shared/bench/lib/t-model-boundary.mjs')).href);
  const { nodeKey, RefinementLattice, RefinementMesh, ScanGrid } = shared;
  const { truth } = tModelTruth();
  const body = (name, count) => ({ groupId: 1, name, model: { kind: 'family', family: 'alpha-t' }, params: { n: 1 }, axes: axesWithCount(count), pivot: { kind: 'fixed' }, method: 'slowroll' });
  let report = `\nrefinement through the API: T-model (slow roll), log α 0.1–100 × N_* 45–65, the 95 % boundary of planck18-bk18, ${load.workers} worker(s); the API follows levels every ${reconcileSeconds} s\n`;

  // The uniform grid.
  let started = Date.now();
  const uniform = await call(load, '/scans', { method: 'POST', body: JSON.stringify(body('benchmark: T-model 256 × 256', 256)) });
  const uniformDone = await completed(load, uniform.id, started);
  const uniformSeconds = (Date.parse(uniformDone.finishedAt) - started) / 1000;
  const uniformLattice = new RefinementLattice(axesWithCount(256), [2, 2], 1);
  const uniformGrid = new ScanGrid(axesWithCount(256));
  const uniformChi2 = new Map((await allPoints(load, `/scans/${uniform.id}/points?status=ok`)).map((p) => [nodeKey(uniformLattice.toFinest(0, uniformGrid.indices(p.pointIndex))), chi2Of(p)]));
  const uniformError = boundaryError(truth, new RefinementMesh(uniformLattice, []), uniformChi2);

  // The refined chain: the parent, then the levels the API creates as each completes.
  const depth = 4;
  started = Date.now();
  const parent = await call(load, '/scans', { method: 'POST', body: JSON.stringify(body('benchmark: T-model 33 × 33, refined', 33)) });
  await completed(load, parent.id, started);
  const estimate = await call(load, `/scans/${parent.id}/refine/estimate?boundary=likelihood&likelihood=planck18-bk18&level=95&factor.alpha=2&factor.nStar=2&depth=${depth}`);
  await call(load, `/scans/${parent.id}/refine`, { method: 'POST', body: JSON.stringify({ boundary, factors: { alpha: 2, nStar: 2 }, depth }) });
  let lineage;
  for (;;) {
    lineage = await call(load, `/scans/${parent.id}/lineage`);
    const last = lineage.levels.at(-1);
    if (lineage.levels.length === depth && last.status === 'completed') break;
    // A chain may end early when no cell is crossed: wait for two follow passes after the last level completes.
    if (last?.status === 'completed') {
      const finishedAt = Date.parse((await call(load, `/scans/${last.scanId}`)).finishedAt);
      if (Date.now() - finishedAt > 2 * reconcileSeconds * 1000 + 2000) break;
    }
    if (Date.now() - started > 1_800_000) throw new Error('the refinement chain did not finish in 30 minutes');
    await sleep(500);
  }
  const levels = await Promise.all(lineage.levels.map((level) => call(load, `/scans/${level.scanId}`)));
  const chainSeconds = (Math.max(...levels.map((level) => Date.parse(level.finishedAt))) - started) / 1000;
  const lattice = new RefinementLattice(axesWithCount(33), [2, 2], depth);
  const grid = new ScanGrid(axesWithCount(33));
  const blocks = new Map(levels.map((level) => [level.id, level.spec.refinement]));
  const chi2 = new Map();
  for (const p of await allPoints(load, `/scans/${parent.id}/refinement/points`)) {
    if (p.status !== 'ok') continue;
    const block = blocks.get(p.scanId);
    const coords = block ? lattice.toFinest(block.level, block.lattice[p.pointIndex]) : lattice.toFinest(0, grid.indices(p.pointIndex));
    chi2.set(nodeKey(coords), chi2Of(p));
  }
  const refinedError = boundaryError(truth, new RefinementMesh(lattice, levels.map((level) => level.spec.refinement.cells)), chi2);
  const refinedPoints = 33 * 33 + levels.reduce((n, level) => n + level.totalPoints, 0);

  const line = (label, points, seconds, error) =>
    `  ${label.padEnd(44)} ${points.toLocaleString('en-US').padStart(7)} points (${((100 * points) / 65536).toFixed(1).padStart(5)} %), ${seconds.toFixed(1).padStart(6)} s; ` +
    `|Δ log10 α| max ${error.max.toExponential(2)}, RMS ${error.rms.toExponential(2)}${error.missing ? `, ${error.missing} crossings not found` : ''}\n`;
  report += line('uniform 256 × 256', 65536, uniformSeconds, uniformError);
  report += line(`33 × 33, factor 2, depth ${depth} (levels ${levels.map((l) => l.totalPoints).join(' + ')})`, refinedPoints, chainSeconds, refinedError);
  report += `  estimate shown before launch: level 1 ${estimate.points} points${estimate.seconds !== null ? `, ${estimate.seconds.toPrecision(2)} s at the parent's pace` : ''} (measured: ${levels[0].totalPoints} points)\n`;
  const met = refinedError.max <= uniformError.max && refinedError.rms <= uniformError.rms && refinedPoints <= 0.15 * 65536;
  report += `  goal (error ≤ the uniform grid's, ≤ 15 % of its points): ${met ? 'met' : 'not met'}\n`;
  process.stdout.write(report);
}
