#!/usr/bin/env node
// The hard cases the engine's validity checks were built for: each case's status, n_s, α_s, r,
// right-hand-side evaluations and time, one line each. Figures only (nothing asserts here; the
// assertions are in shared/test/validity.spec.ts, budgets.spec.ts and mode-start.spec.ts).
// Run after building shared: `node shared/bench/hard-cases.bench.mjs`.
import { RequestEvaluator } from '@sixtyfold/shared';

const engine = new RequestEvaluator({ now: () => performance.now() });
const hilltop = (mu) => ({ potential: 'V0*(1-(phi/mu)^4)', params: { V0: 1e-10, mu } });
const inflection = (b, v) => ({ potential: 'V0*(6*(phi/v)^2 - 8*(1-b)*(phi/v)^3 + 3*(phi/v)^4)', params: { V0: 1e-10, b, v } });
const monodromy = (b, f) => ({ potential: 'monodromy-modulated', params: { mu3: 1e-10, Lambda4: b * 1e-10 * f, f } });

const CASES = [
  ['settles without oscillating, V0*(1 + 0.1*(phi - 3)^2) from 10', { potential: 'V0*(1 + 0.1*(phi - 3)^2)', params: { V0: 1e-10 }, phiInit: 10 }],
  ['settles after a brief end, V0*(1 + 10*(phi - 3)^2) from 10', { potential: 'V0*(1 + 10*(phi - 3)^2)', params: { V0: 1e-10 }, phiInit: 10 }],
  ['tilted cosine from 18.5', { potential: 'V0*(1 - cos(phi/f)) + t*phi', params: { V0: 1e-10, f: 3, t: 1e-12 }, phiInit: 18.5 }],
  ['hilltop quartic μ = 10 from 0.5', { ...hilltop(10), phiInit: 0.5 }],
  ['hilltop quartic μ = 20 from 2', { ...hilltop(20), phiInit: 2 }],
  ['hilltop quartic μ = 5 from 0.18', { ...hilltop(5), phiInit: 0.18 }],
  ['power-law (never ends)', { potential: 'power-law', method: 'slowroll' }],
  ['monodromy-modulated b = 0.05, f = 1e-3', monodromy(0.05, 1e-3)],
  ['monodromy-modulated b = 0.05, f = 3e-4', monodromy(0.05, 3e-4)],
  ['phi^2*(1 + 1e-5*sin(1e3*phi)) from 16', { potential: 'phi^2*(1 + 1e-5*sin(1e3*phi))', phiInit: 16 }],
  ['inflection shape from the steep side, pivot 4 e-folds after arrival', { ...inflection(1e-4, 2.2), phiInit: 4.4, nStar: 81.2 }],
  ['inflection shape, overshoot (v = 0.3, b = 1e-9) from 0.315', { ...inflection(1e-9, 0.3), phiInit: 0.315 }],
  ['slow roll: phi^2*(1+1e-9*sin(1e7*phi)) from 16', { potential: 'phi^2*(1+1e-9*sin(1e7*phi))', phiInit: 16, method: 'slowroll' }],
  ['slow roll: phi^2*(1+1e-5*sin(1e4*phi)) from 16', { potential: 'phi^2*(1+1e-5*sin(1e4*phi))', phiInit: 16, method: 'slowroll' }],
  ['slow roll: natural f = 3', { potential: 'natural', params: { f: 3 }, method: 'slowroll' }],
  ['exact: natural f = 3', { potential: 'natural', params: { f: 3 } }],
  ['step at the pivot (c = 1e-3, d = 0.02)', { potential: '0.5*phi^2*(1 + 1e-3*tanh((phi - 14.9326)/0.02))', phiInit: 16 }],
];

const rows = CASES.map(([label, request]) => {
  const started = performance.now();
  const result = engine.evaluate({ nStar: 55, method: 'exact', ...request });
  const ms = performance.now() - started;
  const number = (x) => (x === null ? '' : Number(x.toPrecision(6)));
  return {
    case: label,
    status: result.status,
    n_s: number(result.ns),
    alpha_s: number(result.alphaS),
    r: number(result.r),
    'N total': number(result.nTotal),
    evaluations: result.evaluations ?? '',
    ms: Math.round(ms),
    message: result.message.slice(0, 90),
  };
});
console.table(rows);
