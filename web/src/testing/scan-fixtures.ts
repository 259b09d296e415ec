import { pointCount, type JudgedLikelihood, type LikelihoodSetEntry, type ScanDetail, type ScanGridSlice, type StoredScanSpec } from '@sixtyfold/shared';

// Scans of the invented Halvorsen Institute groups (see fixtures.ts), with their full detail.

/** Natural inflation over the decay constant f and N_*: 3 × 3 points, N_* fastest. */
export const naturalSpec: StoredScanSpec = {
  groupId: 10,
  name: 'Natural inflation, f against N_*',
  tags: ['axion'],
  note: 'Where natural inflation meets the n_s window.',
  model: { kind: 'family', family: 'natural' },
  params: { Lambda: 5e-3 },
  axes: [
    { kind: 'list', parameter: 'f', values: [5, 7, 10] },
    { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 3, spacing: 'linear' },
  ],
  pivot: { kind: 'fixed' },
  method: 'slowroll',
  potentialSource: 'natural',
};

export function scanDetail(overrides: Partial<ScanDetail> = {}, spec: StoredScanSpec = naturalSpec): ScanDetail {
  const total = pointCount(spec);
  return {
    id: 42,
    groupId: 10,
    ownerId: 2,
    ownerName: 'Tomas Lindqvist',
    name: spec.name,
    method: spec.method,
    status: 'completed',
    tags: spec.tags,
    totalPoints: total,
    donePoints: total,
    failedPoints: 0,
    createdAt: '2026-11-30T09:15:00.000Z',
    finishedAt: '2026-11-30T09:20:00.000Z',
    note: spec.note,
    spec,
    startedAt: '2026-11-30T09:15:05.000Z',
    progress: { total, done: total, failed: 0, running: 0, queued: 0, elapsedSeconds: 295, remainingSeconds: 0 },
    ...overrides,
  };
}

/** The first n of some axis values, continued one apart past their end. */
const firstValues = (values: number[], n: number) => Array.from({ length: n }, (_, i) => values[i] ?? values[values.length - 1] + i);

/** A slice of one point per cell from z[iy][ix] and each point's status (null: not stored); `at` as the API reports it. */
export function slice(
  output: ScanGridSlice['output'],
  z: (number | null)[][],
  status: (string | null)[][],
  { x = { parameter: 'nStar', values: firstValues([50, 55, 60], status[0]?.length ?? 0) }, y = { parameter: 'f', values: firstValues([5, 7, 10], status.length) }, at = {} }: {
    x?: { parameter: string; values: number[] };
    y?: { parameter: string; values: number[] };
    at?: ScanGridSlice['at'];
  } = {},
): ScanGridSlice {
  const axis = ({ parameter, values }: { parameter: string; values: number[] }) => ({ parameter, length: values.length, from: 0, to: values.length - 1, block: 1, values });
  const cells = status.flat();
  const failed: Record<string, number[]> = {};
  cells.forEach((s, c) => {
    if (s !== null && s !== 'ok') (failed[s] ??= new Array<number>(cells.length).fill(0))[c] = 1;
  });
  return {
    x: axis(x),
    y: axis(y),
    output,
    ...(output === 'status' ? {} : { mean: cells.map((s, c) => (s === 'ok' ? (z.flat()[c] ?? null) : null)) }),
    ok: cells.map((s) => (s === 'ok' ? 1 : 0)),
    failed,
    at,
  };
}

/** A built-in likelihood set as `GET /api/likelihood-sets` lists it. */
export function likelihoodSet(overrides: Partial<LikelihoodSetEntry> = {}): LikelihoodSetEntry {
  return {
    key: 'planck18-bk18',
    version: 1,
    name: 'Planck 2018 + BICEP/Keck 2018',
    statement: 'An approximation of the published result, not the published likelihood: a Gaussian in n_s and a half-Gaussian in r.',
    sources: [
      { label: 'Planck 2018 X', citation: 'Planck Collaboration, A&A 641, A10 (2020)', arxiv: '1807.06211' },
      { label: 'BICEP/Keck 2018', citation: 'BICEP/Keck Collaboration, PRL 127, 151301 (2021)', arxiv: '2110.00483' },
    ],
    ns: { mean: 0.9649, sigma: 0.0042 },
    r: { upper95: 0.036, pivotPerMpc: 0.05 },
    builtIn: true,
    addedAt: null,
    ...overrides,
  };
}

/** A set as an answer names what it was judged with. */
export const judgedBy = (set: LikelihoodSetEntry): JudgedLikelihood => ({ ...set, kind: 'set', ref: `${set.key}@${set.version}` });

export const pactSet = likelihoodSet({
  key: 'pact-lb-bk18',
  name: 'P-ACT-LB + BICEP/Keck 2018',
  sources: [{ label: 'ACT DR6', citation: 'Louis et al. (2025)', arxiv: '2503.14452' }],
  ns: { mean: 0.974, sigma: 0.003 },
});
