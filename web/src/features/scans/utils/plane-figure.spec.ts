import { attractorPrediction, findLimits, monomialPrediction, nsInterval, type ScanPlane } from '@sixtyfold/shared';
import { regionLabel } from '@/lib/region-labels';
import { planeFigure, referenceTraces, rFloorOf, SERIES_COLORS } from './plane-figure';

type Trace = { name: string; x: number[]; y: number[]; customdata?: unknown[]; marker?: { color?: unknown; colorbar?: { title?: { text?: string } } } };

const plane = (overrides: Partial<ScanPlane> = {}): ScanPlane => ({
  okPoints: 3,
  stride: 1,
  axisStrides: [1, 1],
  parameters: ['f', 'nStar'],
  pointIndex: [0, 4, 8],
  ns: [0.955, 0.963, 0.968],
  r: [0.11, 0.07, 0.05],
  alphaS: [-7e-4, -6e-4, -5e-4],
  nStar: [50, 55, 60],
  inputs: { f: [5, 7, 10], nStar: [50, 55, 60] },
  ...overrides,
});
const limits = findLimits('planck18-bk18');

describe('the n_s–r plane', () => {
  it('shades n_s interval × r bound rectangles, named as such', () => {
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], limits, rScale: 'linear', references: false }).data as Trace[];
    const [wide, narrow] = data;
    const [low95, high95] = nsInterval(limits, 95);
    expect(wide.name).toBe('n_s 95% interval × r < 0.036 (95%)');
    expect(wide.x).toEqual([low95, high95, high95, low95, low95]);
    expect(wide.y).toEqual([0, 0, 0.036, 0.036, 0]);
    expect(narrow.name).toBe('n_s 68% interval × r < 0.036 (95%)');
    expect(narrow.x[0]).toBeCloseTo(0.9649 - 0.0042, 12);
  });

  it('starts a log r axis below the smallest r, so the regions stay drawable', () => {
    expect(rFloorOf([{ label: 'scan', plane: plane({ r: [0.004, 2e-5] }) }], 'log')).toBeLessThan(2e-5);
    expect(rFloorOf([{ label: 'scan', plane: plane() }], 'linear')).toBe(0);
  });

  it('draws the φ^p and α-attractor lines at N_* = 50 and 60 over their ranges', () => {
    const lines = (referenceTraces() as Trace[]).filter((t) => !t.name.includes('markers'));
    expect(lines.map((t) => t.name)).toEqual([
      'φ^p, N_* = 50 (p = 0.3 to 4)',
      'α-attractor, N_* = 50 (α = 10⁻² to 10²)',
      'φ^p, N_* = 60 (p = 0.3 to 4)',
      'α-attractor, N_* = 60 (α = 10⁻² to 10²)',
    ]);
    const mono50 = lines[0];
    expect([mono50.x[0], mono50.y[0]]).toEqual(Object.values(monomialPrediction(0.3, 50)));
    expect([mono50.x.at(-1), mono50.y.at(-1)]).toEqual(Object.values(monomialPrediction(4, 50)));
    const plateau60 = lines[3];
    expect(plateau60.y[0]).toBeCloseTo(attractorPrediction(1e-2, 60).r, 15);
    expect(plateau60.y.at(-1)).toBeCloseTo(attractorPrediction(1e2, 60).r, 12);
    expect(new Set(plateau60.x)).toEqual(new Set([1 - 2 / 60]));
  });

  it('colours one scan by the chosen parameter and says which point each marker is', () => {
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], colorBy: 'f', limits, rScale: 'linear', references: false }).data as Trace[];
    const points = data.at(-1)!;
    expect(points.marker?.color).toEqual([5, 7, 10]);
    expect(points.marker?.colorbar?.title?.text).toBe('f');
    expect(points.customdata).toEqual([[0, 0], [0, 4], [0, 8]]);
  });

  it('gives several scans a colour each and a legend entry by label', () => {
    const data = planeFigure({
      series: [{ label: 'first', plane: plane() }, { label: 'second', plane: plane({ pointIndex: [1, 2, 3] }) }],
      colorBy: 'f', limits, rScale: 'log', references: true,
    }).data as Trace[];
    const [first, second] = data.slice(-2);
    expect([first.name, second.name]).toEqual(['first', 'second']);
    expect([first.marker?.color, second.marker?.color]).toEqual([SERIES_COLORS[0], SERIES_COLORS[1]]);
    expect(second.customdata?.[0]).toEqual([1, 1]);
  });

  it('outlines each uploaded region closed, named with its confidence level and source, under the points', () => {
    const region = {
      id: 1, groupId: 10, name: 'Survey A', source: 'Invented survey DR2', confidenceLevel: 0.68,
      vertices: [{ ns: 0.95, r: 0 }, { ns: 0.97, r: 0 }, { ns: 0.96, r: 0.04 }], createdById: 2, createdAt: '2026-12-01T10:00:00.000Z',
    };
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], limits, rScale: 'linear', references: false, regions: [region] }).data as Trace[];
    const outline = data.find((t) => t.name === 'Survey A (68% CL, Invented survey DR2)')!;
    expect(regionLabel(region)).toBe('Survey A (68% CL, Invented survey DR2)');
    expect(outline.x).toEqual([0.95, 0.97, 0.96, 0.95]);
    expect(outline.y).toEqual([0, 0, 0.04, 0]);
    expect(data.at(-1)!.name).toBe('scan');
  });
});
