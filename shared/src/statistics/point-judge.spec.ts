import { describe, expect, it } from 'vitest';
import { likelihoodRefSchema } from '../schemas/likelihood-set-entry.schema.js';
import { evidenceComparisonQuerySchema } from '../schemas/scan-constraints.schema.js';
import { scanPointsQuerySchema } from '../schemas/scan-point.schema.js';
import { confidenceOf, deltaChi2Threshold } from './delta-chi2.js';
import { findLikelihoodSet } from './likelihood-sets.js';
import { judgeByRegions, judgeBySet } from './point-judge.js';
import { RegionLikelihood } from './region-likelihood.js';

const square = (half: number) => [
  { ns: 0.965 - half, r: 0.05 - half },
  { ns: 0.965 + half, r: 0.05 - half },
  { ns: 0.965 + half, r: 0.05 + half },
  { ns: 0.965 - half, r: 0.05 + half },
];

describe('judging a point under a set or uploaded regions', () => {
  const regions = judgeByRegions(new RegionLikelihood([{ confidenceLevel: 0.68, vertices: square(0.01) }, { confidenceLevel: 0.95, vertices: square(0.02) }]));

  it('regions: on the inner outline Δχ² is its 2-parameter threshold and the confidence its level', () => {
    const judged = regions({ ns: 0.975, r: 0.05, alphaS: null })!;
    expect(judged.deltaChi2).toBeCloseTo(deltaChi2Threshold(0.68, 2), 12);
    expect(judged.confidence).toBeCloseTo(0.68, 12);
    expect(judged.outsideRegions).toBe(false);
    expect(regions({ ns: 1.1, r: 0.05, alphaS: null })!.outsideRegions).toBe(true);
    expect(regions({ ns: null, r: null, alphaS: null })).toBeNull();
  });

  it('a set: the confidence counts the terms summed (3 with α_s)', () => {
    const set = findLikelihoodSet('planck18')!;
    const judged = judgeBySet(set)({ ns: 0.9649, r: 0.01, alphaS: -0.0045 })!;
    expect(judged.confidence).toBeCloseTo(confidenceOf(judged.deltaChi2, 3), 12);
    expect(judgeBySet(set)({ ns: null, r: 0.01, alphaS: null })).toBeNull();
  });

  it('reads both forms of a likelihood reference, and keeps the set form\'s errors', () => {
    expect(likelihoodRefSchema.parse('planck18-bk18@2')).toEqual({ kind: 'set', key: 'planck18-bk18', version: 2 });
    expect(likelihoodRefSchema.parse('regions:12,13')).toEqual({ kind: 'regions', ids: [12, 13] });
    expect(likelihoodRefSchema.safeParse('Planck').error?.issues[0].message).toBe('name a likelihood set as key or key@version, e.g. planck18-bk18 or planck18-bk18@1');
    expect(likelihoodRefSchema.safeParse('regions:12,12').error?.issues[0].message).toBe('name each region once');
    expect(likelihoodRefSchema.safeParse('regions:').error?.issues[0].message).toBe('name uploaded regions by their ids, e.g. regions:12,13');
    // In a list, bare ids continue the regions reference before them.
    expect(evidenceComparisonQuerySchema.parse({ ids: '3', likelihoods: 'planck18,regions:12,13,pact-lb-bk18' }).likelihoods.map((ref) => ref.kind)).toEqual(['set', 'regions', 'set']);
    const sorted = scanPointsQuerySchema.safeParse({ likelihood: 'regions:12', sort: 'deltaChi2' });
    expect(sorted.error?.issues.map((issue) => issue.path)).toEqual([['sort']]);
  });
});
