import type { ScanGridSlice } from '@sixtyfold/shared';
import { slice } from '@/testing/scan-fixtures';
import { failureSlot } from './failure-colors';
import { colorscaleAt, heatmapFigure, refinedCellShapes, tickIndices } from './heatmap-figure';
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
  it('draws each finer cell from node to node in cell coordinates, coloured on the panel\'s scale; none without refinement', () => {
    // Parent index i is finest coordinate 4i: the cell from finest (2, 0) to (3, 1) spans x 0.5–0.75, y 0–0.25.
    const refined = { ...ns, refined: { scale: [4, 4] as [number, number], cells: [{ level: 2, x: [2, 3] as [number, number], y: [0, 1] as [number, number], mean: 0.965 }, { level: 2, x: [3, 4] as [number, number], y: [0, 1] as [number, number], mean: null }] } };
    const shapes = refinedCellShapes(refined)!;
    expect(shapes).toHaveLength(1);
    expect(shapes[0]).toMatchObject({ type: 'rect', x0: 0.5, x1: 0.75, y0: 0, y1: 0.25, fillcolor: colorscaleAt(1) });
    expect(heatmapFigure({ slice: refined }).layout.shapes).toHaveLength(1);
    expect(refinedCellShapes(ns)).toEqual([]);
    // On a shared range, the colour follows it: 0.963 is the middle of 0.961–0.965.
    expect(refinedCellShapes({ ...refined, refined: { ...refined.refined, cells: [{ ...refined.refined.cells[0], mean: 0.963 }] } }, [0.961, 0.965])![0]).toMatchObject({ fillcolor: colorscaleAt(0.5) });
    expect(colorscaleAt(0)).toBe('rgb(17, 23, 53)');
    expect(colorscaleAt(0.5)).toBe('rgb(140, 90, 168)');
  });
});
