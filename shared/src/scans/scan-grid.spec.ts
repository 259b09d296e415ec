import { describe, expect, it } from 'vitest';
import { RequestEvaluator } from '../engine/evaluate-request.js';
import { createScanSchema, type CreateScanInput } from '../schemas/scan.schema.js';
import { axisValues, pointCount, pointLimitProblem, ScanGrid } from './scan-grid.js';
import { pointRequest } from './scan-point.js';

const base: CreateScanInput = {
  groupId: 1,
  name: 'Starobinsky over N_*',
  model: { kind: 'family', family: 'natural' },
  params: { Lambda: 5e-3 },
  axes: [
    { kind: 'range', parameter: 'f', min: 1, max: 100, count: 3, spacing: 'log' },
    { kind: 'list', parameter: 'nStar', values: [50, 55, 60] },
  ],
  pivot: { kind: 'fixed' },
  method: 'slowroll',
};

const errors = (input: unknown) => {
  const result = createScanSchema.safeParse(input);
  return result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
};

describe('scan specification', () => {
  it('accepts a well-formed scan and counts its points before submission', () => {
    const spec = createScanSchema.parse(base);
    expect(pointCount(spec)).toBe(9);
    expect(spec.tags).toEqual([]);
  });

  it('spaces axes linearly or logarithmically and ends exactly on max', () => {
    expect(axisValues({ kind: 'range', parameter: 'f', min: 1, max: 100, count: 3, spacing: 'log' })).toEqual([1, 10, 100]);
    const linear = axisValues({ kind: 'range', parameter: 'f', min: 0.1, max: 0.7, count: 7, spacing: 'linear' });
    expect(linear[6]).toBe(0.7);
    expect(linear[3]).toBeCloseTo(0.4, 15);
    expect(axisValues({ kind: 'range', parameter: 'f', min: 2, max: 2, count: 1, spacing: 'linear' })).toEqual([2]);
  });

  it('refuses contradictory or impossible specifications, saying what is wrong', () => {
    expect(errors({ ...base, axes: [] })).toContain('axes: add at least one axis');
    expect(errors({ ...base, axes: [...base.axes, base.axes[0], base.axes[0], base.axes[0]] })).toContain('axes: a scan has at most 4 axes');
    expect(errors({ ...base, axes: [base.axes[0], base.axes[0]] })).toContain('axes.1.parameter: f is on two axes');
    expect(errors({ ...base, params: { Lambda: 5e-3, f: 3 } })).toContain('axes.0.parameter: f is both fixed and on an axis');
    expect(errors({ ...base, axes: [{ kind: 'range', parameter: 'f', min: 0, max: 10, count: 4, spacing: 'log' }, base.axes[1]] }))
      .toContain('axes.0.min: a logarithmic axis needs min > 0');
    expect(errors({ ...base, axes: [{ kind: 'range', parameter: 'f', min: 5, max: 1, count: 4, spacing: 'linear' }, base.axes[1]] }))
      .toContain('axes.0.max: max must be above min');
    expect(errors({ ...base, axes: [base.axes[0]] })).toContain('pivot.nStar: give N_* or put it on an axis');
    expect(errors({ ...base, pivot: { kind: 'reheating', w: 0 } })).toEqual(expect.arrayContaining([
      'axes.1.parameter: an N_* axis needs a fixed pivot, not reheating',
    ]));
    expect(errors({ ...base, params: { Lambda: Number.NaN } })).toContain('params.Lambda: each parameter value must be a finite number');
  });

  it('states by how much a scan exceeds a limit', () => {
    expect(pointLimitProblem(1_250_000, 1_000_000, "the group's")).toBe(
      "This scan has 1,250,000 points, 250,000 more than the group's limit of 1,000,000",
    );
    expect(pointLimitProblem(10, 1_000_000, "the group's")).toBeNull();
  });

  it('expands point i with the last axis fastest, covering the grid once', () => {
    const grid = new ScanGrid(createScanSchema.parse(base).axes);
    expect(grid.size).toBe(9);
    expect(grid.point(0)).toEqual({ f: 1, nStar: 50 });
    expect(grid.point(1)).toEqual({ f: 1, nStar: 55 });
    expect(grid.point(5)).toEqual({ f: 10, nStar: 60 });
    const seen = new Set(Array.from({ length: 9 }, (_, i) => JSON.stringify(grid.point(i))));
    expect(seen.size).toBe(9);
    expect(() => grid.point(9)).toThrow(RangeError);
  });

  it('turns a point into an engine request that the engine accepts', () => {
    const spec = createScanSchema.parse(base);
    const grid = new ScanGrid(spec.axes);
    const request = pointRequest(spec, 'natural', grid.point(5));
    expect(request).toMatchObject({ potential: 'natural', params: { Lambda: 5e-3, f: 10 }, nStar: 60, method: 'slowroll' });
    const result = new RequestEvaluator().evaluate(request);
    expect(result.status).toBe('ok');
    expect(result.nStar).toBe(60);

    const reheating = createScanSchema.parse({
      ...base,
      axes: [base.axes[0], { kind: 'list', parameter: 'reheatingW', values: [0, 1 / 3] }],
      pivot: { kind: 'reheating', energyGeV: 1e12 },
    });
    const r = pointRequest(reheating, 'natural', new ScanGrid(reheating.axes).point(1));
    expect(r.reheating).toEqual({ w: 1 / 3, energyGeV: 1e12 });
    expect(r.params).toEqual({ Lambda: 5e-3, f: 1 });
  });
});
