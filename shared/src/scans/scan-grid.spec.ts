import { describe, expect, it } from 'vitest';
import { RequestEvaluator } from '../engine/evaluate-request.js';
import { createScanSchema, type CreateScanInput } from '../schemas/scan.schema.js';
import { axisValues, pointCount, pointLimitProblem, ScanGrid, ScanPointList, scanPoints, variedInputs } from './scan-grid.js';
import { pointRequest } from './scan-point.js';

const axes: NonNullable<CreateScanInput['axes']> = [
  { kind: 'range', parameter: 'f', min: 1, max: 100, count: 3, spacing: 'log' },
  { kind: 'list', parameter: 'nStar', values: [50, 55, 60] },
];
const base = {
  groupId: 1,
  name: 'Starobinsky over N_*',
  model: { kind: 'family', family: 'natural' },
  params: { Lambda: 5e-3 },
  axes,
  pivot: { kind: 'fixed' },
  method: 'slowroll',
} satisfies CreateScanInput;

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
    const grid = new ScanGrid(createScanSchema.parse(base).axes!);
    expect(grid.size).toBe(9);
    expect(grid.point(0)).toEqual({ f: 1, nStar: 50 });
    expect(grid.point(1)).toEqual({ f: 1, nStar: 55 });
    expect(grid.point(5)).toEqual({ f: 10, nStar: 60 });
    const seen = new Set(Array.from({ length: 9 }, (_, i) => JSON.stringify(grid.point(i))));
    expect(seen.size).toBe(9);
    expect(() => grid.point(9)).toThrow(RangeError);
  });

  it('finds the point of a cell: the cell of point(i) has index i, for grids of 1 to 4 axes', () => {
    const lengths = [3, 4, 2, 5];
    for (let axisCount = 1; axisCount <= 4; axisCount++) {
      const grid = new ScanGrid(lengths.slice(0, axisCount).map((count, a) => ({ kind: 'list', parameter: `p${a}`, values: Array.from({ length: count }, (_, v) => 10 * a + v) })));
      for (let i = 0; i < grid.size; i++) {
        // Axis a's values are 10a + v, so point(i) names its own cell.
        const cell = Object.values(grid.point(i)).map((value, a) => value - 10 * a);
        expect(grid.indexOf(cell)).toBe(i);
        expect(grid.indices(i)).toEqual(cell);
      }
    }
    // Closed form, last axis fastest: ((i·4 + j)·2 + k)·5 + l.
    const four = new ScanGrid(lengths.map((count, a) => ({ kind: 'range', parameter: `p${a}`, min: 0, max: 1, count, spacing: 'linear' })));
    expect(four.indexOf([2, 1, 1, 3])).toBe(((2 * 4 + 1) * 2 + 1) * 5 + 3);
    expect(() => four.indexOf([3, 0, 0, 0])).toThrow(RangeError);
    expect(() => four.indexOf([0, 0, 0])).toThrow(RangeError);
  });

  it('lays out the points of a 2-D slice, the other axes held at their index', () => {
    const grid = new ScanGrid([
      { kind: 'list', parameter: 'a', values: [1, 2] },
      { kind: 'list', parameter: 'b', values: [5, 6, 7] },
      { kind: 'list', parameter: 'c', values: [8, 9] },
    ]);
    // x = b, y = a, c at index 1: point index a·6 + b·2 + 1.
    expect(grid.sliceIndices(1, 0, [0, 0, 1])).toEqual([
      [1, 3, 5],
      [7, 9, 11],
    ]);
    // x = c, y = b, a at index 1 (the x and y entries of the cell are ignored).
    expect(grid.sliceIndices(2, 1, [1, 2, 0])).toEqual([
      [6, 7],
      [8, 9],
      [10, 11],
    ]);
    expect(() => grid.sliceIndices(1, 1, [0, 0, 0])).toThrow(RangeError);
  });

  it('turns a point into an engine request that the engine accepts', () => {
    const spec = createScanSchema.parse(base);
    const grid = new ScanGrid(spec.axes!);
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
    const r = pointRequest(reheating, 'natural', new ScanGrid(reheating.axes!).point(1));
    expect(r.reheating).toEqual({ w: 1 / 3, energyGeV: 1e12 });
    expect(r.params).toEqual({ Lambda: 5e-3, f: 1 });
  });
});

describe('scans over a list of points', () => {
  const { axes: _, ...noAxes } = base;
  const listed = {
    ...noAxes,
    pointList: { columns: ['f', 'nStar'], rows: [[10, 60], [1, 50], [100, 55]] },
  } satisfies CreateScanInput;

  it('takes a point list instead of axes, exactly one of the two', () => {
    const spec = createScanSchema.parse(listed);
    expect(pointCount(spec)).toBe(3);
    expect(variedInputs(spec)).toEqual(['f', 'nStar']);
    expect(variedInputs(createScanSchema.parse(base))).toEqual(['f', 'nStar']);
    expect(errors({ ...listed, axes: base.axes })).toContain('axes: give axes or a point list, not both');
    expect(errors(noAxes)).toContain('axes: add at least one axis');
  });

  it('checks the columns as it checks axes', () => {
    const list = (columns: string[], rows: number[][]) => ({ ...listed, pointList: { columns, rows } });
    expect(errors(list(['f', 'f'], [[1, 2]]))).toContain('pointList.columns.1: f is a column twice');
    expect(errors({ ...listed, params: { Lambda: 5e-3, f: 3 } })).toContain('pointList.columns.0: f is both fixed and a column');
    expect(errors(list(['f'], [[1]]))).toContain('pivot.nStar: give N_* or add a column nStar');
    expect(errors({ ...list(['f'], [[1]]), pivot: { kind: 'fixed', nStar: 55 } })).toEqual([]);
    expect(errors({ ...listed, pivot: { kind: 'fixed', nStar: 55 } })).toContain('pivot.nStar: N_* is both fixed and in a column');
    expect(errors({ ...listed, pivot: { kind: 'reheating', w: 0, energyGeV: 1e12 } })).toContain('pointList.columns.1: an N_* column needs a fixed pivot, not reheating');
    expect(errors({ ...list(['f', 'reheatingW'], [[1, 0]]) })).toContain('pointList.columns.1: reheatingW needs N_* from reheating');
    expect(errors(list(['f', 'nStar'], [[1, 50], [2]]))).toContain('pointList.rows.1: point 1 has 1 values for 2 columns');
    expect(errors(list(['f', 'nStar'], [[1, Number.NaN]]))).toContain('pointList.rows.0.1: every value must be a finite number');
    expect(errors(list(['f', 'nStar'], []))).toContain('pointList.rows: the point list has no points');
  });

  it('gives point i as row i, by column name', () => {
    const points = new ScanPointList(createScanSchema.parse(listed).pointList!);
    expect(points.size).toBe(3);
    expect(points.point(0)).toEqual({ f: 10, nStar: 60 });
    expect(points.point(2)).toEqual({ f: 100, nStar: 55 });
    expect(() => points.point(3)).toThrow(RangeError);
    expect(() => points.point(-1)).toThrow(RangeError);
  });

  it('makes the same engine request as the equal grid point', () => {
    const grid = createScanSchema.parse(base);
    const list = createScanSchema.parse(listed);
    expect(scanPoints(grid)).toBeInstanceOf(ScanGrid);
    expect(scanPoints(list)).toBeInstanceOf(ScanPointList);
    // Grid point 5 is f = 10, N_* = 60, the list's first row.
    const fromGrid = pointRequest(grid, 'natural', scanPoints(grid).point(5));
    const fromList = pointRequest(list, 'natural', scanPoints(list).point(0));
    expect(fromList).toEqual(fromGrid);
    const engine = new RequestEvaluator();
    expect(engine.evaluate(fromList)).toEqual(engine.evaluate(fromGrid));

    const reheating = createScanSchema.parse({
      ...noAxes,
      pointList: { columns: ['reheatingW', 'f'], rows: [[1 / 3, 1]] },
      pivot: { kind: 'reheating', energyGeV: 1e12 },
    });
    const r = pointRequest(reheating, 'natural', scanPoints(reheating).point(0));
    expect(r.reheating).toEqual({ w: 1 / 3, energyGeV: 1e12 });
    expect(r.params).toEqual({ Lambda: 5e-3, f: 1 });
  });
});
