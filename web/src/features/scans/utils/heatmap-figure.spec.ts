import type { ScanGridSlice } from '@sixtyfold/shared';
import { slice } from '@/testing/scan-fixtures';
import { failureColor, failureSlot } from './failure-colors';
import { colorscaleAt, heatmapFigure, refinedBoundaryLines, refinedCellShapes, tickIndices } from './heatmap-figure';
import { SET_COLORS } from './plane-figure';

type Trace = { type: string; name: string; contours?: { start: number; end: number; coloring: string }; line?: { color: string; dash: string }; z?: (number | null)[][]; text?: string[][]; zmin?: number; zmax?: number; x?: (number | null)[] };

const status = [
  ['ok', 'insufficient_efolds', 'ok'],
  ['ok', null, 'no_end'],
];
const ns = slice('ns', [[0.961, null, 0.965], [0.962, null, null]], status, { y: { parameter: 'f', values: [5, 7] } });
const r = slice('r', [[0.071, null, 0.052], [0.07, null, null]], status, { y: { parameter: 'f', values: [5, 7] } });

describe('heatmap traces', () => {
  it('never draws a failed cell as a number: it goes to the overlay, by reason', () => {
    const traces = heatmapFigure({ slice: ns }).data as Trace[];
    const [values, failed] = traces;
    expect(values.z).toEqual([[0.961, null, 0.965], [0.962, null, null]]);
    expect(failed.name).toBe('failed');
    expect(failed.z).toEqual([
      [null, failureSlot('insufficient_efolds'), null],
      [null, null, failureSlot('no_end')],
    ]);
    expect(failureSlot('insufficient_efolds')).not.toBe(failureSlot('no_end'));
  });

  it('says on hover where a cell is and what came out there', () => {
    const cut = slice('alphaS', [[-6e-4, null, -5e-4], [-6.1e-4, null, null]], status, {
      y: { parameter: 'f', values: [5, 7] },
      at: { Lambda: { index: 1, value: 0.005 } },
    });
    const [values] = heatmapFigure({ slice: cut, hoverSlices: [ns, r] }).data as Trace[];
    expect(values.text![0][0]).toBe('N_* = 50<br>f = 5<br>Lambda = 0.005<br>n_s = 0.961<br>r = 0.071<br>α_s = -6.0000e-4');
    expect(values.text![0][1]).toContain('failed: insufficient_efolds');
    expect(values.text![0][1]).not.toContain('n_s =');
    expect(values.text![1][1]).toContain('not stored yet');
  });

  it('uses a shared colour range when given one, on log₁₀ for outputs spanning decades', () => {
    const [values] = heatmapFigure({ slice: ns, zRange: [0.95, 0.98] }).data as Trace[];
    expect([values.zmin, values.zmax]).toEqual([0.95, 0.98]);
    const scale = slice('amplitudeScale', [[1e-10, 1e-8]], [['ok', 'ok']], { x: { parameter: 'f', values: [5, 7] }, y: { parameter: 'nStar', values: [55] } });
    const [logged] = heatmapFigure({ slice: scale, zRange: [1e-11, 1e-7] }).data as Trace[];
    expect(logged.z).toEqual([[-10, -8]]);
    expect([logged.zmin, logged.zmax]).toEqual([-11, -7]);
  });

  it('draws each set’s 68 and 95 % boundaries as contour lines of its Δχ² at 2.30 and 6.18', () => {
    const chi2 = slice('deltaChi2', [[0.5, null, 9], [3, null, null]], status, { y: { parameter: 'f', values: [5, 7] } });
    const lines = (heatmapFigure({ slice: ns, boundaries: [{ slice: chi2, color: SET_COLORS[1] }] }).data as Trace[]).filter((t) => t.type === 'contour');
    // Two levels, each a white line under the set's coloured one.
    expect(lines).toHaveLength(4);
    expect(lines.map((t) => t.contours!.start.toFixed(4))).toEqual(['2.2957', '2.2957', '6.1801', '6.1801']);
    expect(lines.every((t) => t.contours!.start === t.contours!.end && t.contours!.coloring === 'none')).toBe(true);
    expect(lines[1].line).toMatchObject({ color: `rgb(${SET_COLORS[1].rgb})`, dash: 'solid' });
    expect(lines[3].line!.dash).toBe('dash');
    expect(lines[0].z).toEqual([[0.5, null, 9], [3, null, null]]);
    expect((heatmapFigure({ slice: ns }).data as Trace[]).some((t) => t.type === 'contour')).toBe(false);
  });

  it('draws a status slice as ok cells plus the failure overlay', () => {
    const traces = heatmapFigure({ slice: slice('status', [], status, { y: { parameter: 'f', values: [5, 7] } }) }).data as Trace[];
    expect(traces.map((t) => t.name)).toEqual(['ok', 'failed']);
    expect(traces[0].z).toEqual([[1, null, 1], [1, null, null]]);
  });

  it('states what a cell stands for on the plot, and hovers a block with its statistics and counts', () => {
    expect(heatmapFigure({ slice: ns }).layout.annotations).toEqual([expect.objectContaining({ text: 'one point per cell' })]);
    const blocks: ScanGridSlice = {
      x: { parameter: 'nStar', length: 3, from: 0, to: 2, block: 2, values: [50, 60] },
      y: { parameter: 'f', length: 2, from: 0, to: 1, block: 2, values: [5] },
      output: 'ns', at: {},
      mean: [0.9615, null], min: [0.961, null], max: [0.962, null],
      ok: [2, 0],
      failed: { insufficient_efolds: [1, 0], no_end: [0, 1] },
    };
    const { data, layout } = heatmapFigure({ slice: blocks });
    expect(layout.annotations).toEqual([expect.objectContaining({ text: 'blocks of 2 × 2 points: mean' })]);
    const [values, failed] = data as Trace[];
    expect(values.z).toEqual([[0.9615, null]]);
    // A block without OK points takes the colour of its failures.
    expect(failed.z).toEqual([[null, failureSlot('no_end')]]);
    expect(values.text![0][0]).toBe('N_* = 50 (first of 2 values)<br>f = 5 (first of 2 values)<br>2 of 4 points ok; failed: 1 insufficient_efolds<br>n_s mean 0.9615, 0.961 to 0.962');
    expect(values.text![0][1]).toContain('0 of 2 points ok; failed: 1 no_end');
  });

  it('labels the axes with their values and says when one is log-spaced', () => {
    const logAxis = slice('ns', [[0.96, 0.96, 0.96, 0.96]], [['ok', 'ok', 'ok', 'ok']], { x: { parameter: 'alpha', values: [0.01, 0.1, 1, 10] }, y: { parameter: 'nStar', values: [55] } });
    const { layout } = heatmapFigure({ slice: logAxis });
    expect(layout.xaxis?.title).toEqual({ text: 'alpha (log-spaced)' });
    expect(layout.xaxis?.ticktext).toEqual(['0.01', '0.1', '1', '10']);
    expect(layout.yaxis?.title).toEqual({ text: 'N_*' });
    expect(tickIndices(100)).toEqual([0, 17, 33, 50, 66, 83, 99]);
  });
});

describe('refined cells over a heatmap', () => {
  type Cell = NonNullable<ScanGridSlice['refined']>['cells'][number];
  const cell = (x: [number, number], y: [number, number], corners: Cell['corners'], failure: string | null = null): Cell => ({ level: 2, x, y, corners, failure });

  it('draws each finer cell from node to node in cell coordinates, coloured on the panel\'s scale by its corners\' mean; none without refinement', () => {
    // Parent index i is finest coordinate 4i: the cell from finest (2, 0) to (3, 1) spans x 0.5–0.75, y 0–0.25.
    const refined = { ...ns, refined: { scale: [4, 4] as [number, number], cells: [cell([2, 3], [0, 1], [0.964, 0.966, 0.965, 0.965]), cell([3, 4], [0, 1], [null, null, null, null], 'no_end')] } };
    const shapes = refinedCellShapes(refined)!;
    expect(shapes).toHaveLength(1);
    expect(shapes[0]).toMatchObject({ type: 'rect', x0: 0.5, x1: 0.75, y0: 0, y1: 0.25, fillcolor: colorscaleAt(1) });
    expect(heatmapFigure({ slice: refined }).layout.shapes).toHaveLength(1);
    expect(refinedCellShapes(ns)).toEqual([]);
    // On a shared range, the colour follows it: 0.963 (the known corners' mean) is the middle of 0.961–0.965.
    expect(refinedCellShapes({ ...refined, refined: { ...refined.refined, cells: [cell([2, 3], [0, 1], [0.962, null, 0.964, 0.963])] } }, [0.961, 0.965])![0]).toMatchObject({ fillcolor: colorscaleAt(0.5) });
    expect(colorscaleAt(0)).toBe('rgb(17, 23, 53)');
    expect(colorscaleAt(0.5)).toBe('rgb(140, 90, 168)');
  });

  it('draws the status panel\'s finer cells as computed, or in the colour of a failed corner\'s reason', () => {
    const statusSlice = { ...slice('status', [], status), refined: { scale: [2, 2] as [number, number], cells: [cell([0, 1], [0, 1], [null, null, null, null]), cell([1, 2], [0, 1], [null, null, null, null], 'no_end')] } };
    const shapes = refinedCellShapes(statusSlice)!;
    expect(shapes.map((shape) => shape.fillcolor)).toEqual(['#d9dcea', failureColor('no_end')]);
    expect(shapes[1]).toMatchObject({ x0: 0.5, x1: 1, y0: 0, y1: 0.5 });
  });

  it('draws a set\'s boundary through the finer cells where they are, and between the panel\'s cells elsewhere', () => {
    // Δχ² = 3x on a 3 × 3 grid: the 68 % line (2.30) between the centres x = 0 and 1 lies at x = 0.767.
    // The finer cells of the first column's lower cell carry Δχ² = 3x + 0.3: there it lies at x = 0.667.
    const rows = [0, 1, 2].map(() => [0, 3, 6]);
    const ok = rows.map((row) => row.map(() => 'ok'));
    const fine = (x0: number, y0: number) => cell([x0, x0 + 1], [y0, y0 + 1], [1.5 * x0 + 0.3, 1.5 * (x0 + 1) + 0.3, 1.5 * x0 + 0.3, 1.5 * (x0 + 1) + 0.3]);
    const chi2 = { ...slice('deltaChi2', rows, ok, { x: { parameter: 'nStar', values: [50, 55, 60] }, y: { parameter: 'f', values: [5, 7, 10] } }), refined: { scale: [2, 2] as [number, number], cells: [fine(0, 0), fine(1, 0), fine(0, 1), fine(1, 1)] } };
    const points = refinedBoundaryLines(chi2, 2.3).flat();
    expect(points.length).toBeGreaterThan(2);
    for (const [x, y] of points) expect(x).toBeCloseTo(y < 1 ? 2 / 3 : y > 1 ? 2.3 / 3 : x, 12);
    expect(points.some(([, y]) => y < 1)).toBe(true);
    expect(points.some(([, y]) => y > 1)).toBe(true);
    // Drawn as path shapes after the refined cells (shapes lie above every trace, so a trace would be hidden
    // under them), not as Plotly's contour of the coarse cells; the 95 % level (6.18) is never reached.
    const { data, layout } = heatmapFigure({ slice: { ...ns, refined: chi2.refined }, boundaries: [{ slice: chi2, color: SET_COLORS[0] }] });
    expect((data as Trace[]).some((t) => t.type === 'contour')).toBe(false);
    const shapes = layout.shapes as { type: string; name?: string; path?: string; line?: { color: string; dash: string } }[];
    const lines = shapes.filter((shape) => shape.type === 'path');
    expect(lines.map((shape) => [shape.name, shape.line!.dash, shape.line!.color])).toEqual([['Δχ² = 2.30', 'solid', '#ffffff'], ['Δχ² = 2.30', 'solid', `rgb(${SET_COLORS[0].rgb})`]]);
    expect(shapes.findIndex((shape) => shape.type === 'path')).toBeGreaterThan(shapes.findLastIndex((shape) => shape.type === 'rect'));
    // Two polylines: through the finer cells, then from y = 1 on between the panel's cells (where a coarse cell meets finer ones the line breaks).
    expect(lines[0].path).toMatch(/^M[\d.]+,[\d.]+( L[\d.]+,[\d.]+)+ M[\d.]+,[\d.]+( L[\d.]+,[\d.]+)+$/);
  });
});
