// `npm run bench -- reproduce`: "Check reproducibility" on a stored scan, the way a group would ask for
// it. An exact-method (mode equations) α-attractor T-model scan of 20 × 20 points is computed by the
// workers and stored; then a random sample of 200 of its points is recomputed through the queue on
// today's engine and compared bit for bit. Printed: per output identical or the largest relative
// difference, the builds involved, and the check's time. Figures only; the tests assert the behaviour.
import { call, completed, sleep } from './api-calls.mjs';

const SAMPLE = 200;

export async function benchReproduce(load) {
  const started = Date.now();
  const scan = await call(load, '/scans', {
    method: 'POST',
    body: JSON.stringify({
      groupId: 1, name: 'benchmark: reproducibility, T-model exact 20 × 20', model: { kind: 'family', family: 'alpha-t' }, params: { n: 1 },
      axes: [{ kind: 'range', parameter: 'alpha', min: 0.1, max: 100, count: 20, spacing: 'log' }, { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 20, spacing: 'linear' }],
      pivot: { kind: 'fixed' }, method: 'exact',
    }),
  });
  const stored = await completed(load, scan.id, started);
  const computeSeconds = (Date.parse(stored.finishedAt) - started) / 1000;

  const asked = Date.now();
  let check = await call(load, `/scans/${scan.id}/reproductions`, { method: 'POST', body: JSON.stringify({ sampleSize: SAMPLE }) });
  while (check.status !== 'completed' && check.status !== 'failed') {
    if (Date.now() - asked > 1_800_000) throw new Error('the reproducibility check did not finish in 30 minutes');
    await sleep(500);
    check = await call(load, `/scans/${scan.id}/reproductions/${check.id}`);
  }
  if (check.status !== 'completed') throw new Error(`the reproducibility check failed: ${check.error}`);
  const checkSeconds = (Date.parse(check.finishedAt) - asked) / 1000;
  const build = (b) => (b ? `engine ${b.engineVersion}, commit ${b.commit}, Node ${b.node}` : 'not recorded');

  let report = `\nreproducibility: T-model (n = 1), exact method, log α 0.1–100 × N_* 50–60, 20 × 20 = ${stored.totalPoints} points (${stored.donePoints} ok) stored in ${computeSeconds.toFixed(1)} s by ${load.workers} worker(s)\n`;
  report += `  sample: ${check.pointIndices.length} points at random, recomputed through the queue in ${checkSeconds.toFixed(1)} s by ${check.checkedBuild?.worker ?? 'a worker'}\n`;
  report += `  scan's build:  ${build(check.scanBuild)}\n  today's build: ${build(check.checkedBuild)}\n`;
  for (const o of check.report.outputs) {
    report += `  ${o.output.padEnd(16)} ${o.identical ? 'identical' : `different at ${o.differing} of ${o.compared} points, largest relative difference ${o.maxRelativeDifference?.toExponential(2)} (point ${o.atPointIndex})`}${o.identical ? ` (${o.compared} points)` : ''}\n`;
  }
  report += `  statuses changed: ${check.report.statusChanges.length}; every output of every point bit-identical: ${check.report.identical ? 'yes' : 'no'}\n`;
  process.stdout.write(report);
}
