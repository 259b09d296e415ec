import { describe, expect, it } from 'vitest';
import type { ReproducedPoint } from '../schemas/scan-reproduction.schema.js';
import { compareReproduction, relativeDifference } from './compare-reproduction.js';

const point = (pointIndex: number, values: Partial<ReproducedPoint> = {}): ReproducedPoint => ({
  pointIndex, status: 'ok', ns: 0.96 + pointIndex * 1e-3, r: 0.01, alphaS: -6e-4, As: 2.1e-9, amplitudeScale: 1.5, nTotal: 70, nStar: 55,
  phiStar: 5, phiEnd: 0.7, energyScaleGeV: 1e16, ...values,
});

describe('compareReproduction', () => {
  it('finds identical points identical in every output', () => {
    const stored = [point(0), point(3), point(7)];
    const report = compareReproduction(stored, stored.map((p) => ({ ...p })).reverse());
    expect(report.identical).toBe(true);
    expect(report.outputs.every((o) => o.identical && o.compared === 3 && o.maxRelativeDifference === null)).toBe(true);
  });

  it('reports the largest relative difference of an output and its point', () => {
    const ns3 = 0.963 * (1 + 1e-12);
    const ns7 = 0.967 * (1 + 3e-12);
    const report = compareReproduction([point(0), point(3), point(7)], [point(0), point(3, { ns: ns3 }), point(7, { ns: ns7 })]);
    const ns = report.outputs.find((o) => o.output === 'ns')!;
    expect(ns).toMatchObject({ identical: false, differing: 2, atPointIndex: 7 });
    expect(ns.maxRelativeDifference).toBe(relativeDifference(0.967, ns7));
    expect(report.outputs.filter((o) => !o.identical).map((o) => o.output)).toEqual(['ns']);
    expect(report.identical).toBe(false);
  });

  it('tells a difference in the last bit, and 0 from −0', () => {
    const next = 0.96 + Number.EPSILON;
    expect(compareReproduction([point(0, { ns: 0.96 })], [point(0, { ns: next })]).identical).toBe(false);
    expect(compareReproduction([point(0, { alphaS: 0 })], [point(0, { alphaS: -0 })]).identical).toBe(false);
  });

  it('counts a value present on one side only, and a changed status', () => {
    const report = compareReproduction([point(2)], [point(2, { status: 'slow_roll_invalid', ns: null })]);
    expect(report.outputs.find((o) => o.output === 'ns')).toMatchObject({ identical: false, differing: 1, maxRelativeDifference: null, atPointIndex: 2 });
    expect(report.statusChanges).toEqual([{ pointIndex: 2, stored: 'ok', recomputed: 'slow_roll_invalid' }]);
  });

  it('measures relative differences symmetrically', () => {
    expect(relativeDifference(1, 1)).toBe(0);
    expect(relativeDifference(2, 1)).toBe(0.5);
    expect(relativeDifference(1, 2)).toBe(0.5);
    expect(relativeDifference(-1, 1)).toBe(2);
  });
});
