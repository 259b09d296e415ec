#!/usr/bin/env node
// One share of the benchmark grid, computed by the engine alone in its own process, so that the
// benchmark can time the engine on the same cores as the workers. Arguments: the scan body (JSON),
// this share's index and the number of shares. Prints {"points": n, "seconds": s}.
import { createScanSchema, pointRequest, RequestEvaluator, ScanGrid } from '@sixtyfold/shared';

const [body, share, shares] = [JSON.parse(process.argv[2]), Number(process.argv[3]), Number(process.argv[4])];
const spec = { ...createScanSchema.parse(body), potentialSource: body.model.family };
const grid = new ScanGrid(spec.axes);
const engine = new RequestEvaluator();
const run = (from, to) => {
  for (let i = from; i < to; i++) engine.evaluate(pointRequest(spec, body.model.family, grid.point(i)));
};
// Warm-up, as the workers had: the model parsed once and the JIT settled.
run(0, Math.min(grid.size, 2000));
const from = Math.floor((grid.size * share) / shares);
const to = Math.floor((grid.size * (share + 1)) / shares);
const start = performance.now();
run(from, to);
process.stdout.write(JSON.stringify({ points: to - from, seconds: (performance.now() - start) / 1000 }));
