import { attractorPrediction, findLikelihoodSet, monomialPrediction, type ScanPlane } from '@sixtyfold/shared';
import { regionLabel } from '@/lib/region-labels';
import { planeFigure, referenceTraces, rFloorOf, SERIES_COLORS, SET_COLORS } from './plane-figure';

type Trace = { name: string; x: number[]; y: number[]; fillcolor?: string; line?: { dash?: string }; customdata?: unknown[]; marker?: { color?: unknown; colorbar?: { title?: { text?: string } } } };

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
const planckBk = findLikelihoodSet('planck18-bk18')!;
const pact = findLikelihoodSet('pact-lb-bk18')!;
const likelihoods = [planckBk];

describe('the n_s–r plane', () => {
  it('fills each set’s joint 68 and 95 % regions, the wider one first, as half-ellipses on r ≥ 0', () => {
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], likelihoods, rScale: 'linear', references: false }).data as Trace[];
    const [wide, narrow] = data;
    expect(wide.name).toBe('Planck 2018 + BICEP/Keck 2018: 95.4 % (Δχ² ≤ 6.18)');
    expect(narrow.name).toBe('Planck 2018 + BICEP/Keck 2018: 68.3 % (Δχ² ≤ 2.30)');
    expect(wide.line?.dash).toBe('dash');
    // A Gaussian in n_s (0.9649 ± 0.0042) and a half-Gaussian in r with σ_r = 0.036/1.96: the region
    // Δχ² ≤ t ends on r = 0 at n_s = μ ± σ√t and is highest, r = σ_r√t, at n_s = μ (closed form).
    // t = 2.2957 and 6.1801 are the χ² quantiles of 1σ and 2σ in two parameters (Press et al., Numerical Recipes §15.6).
    const t68 = 2.2957489;
    expect(Math.min(...narrow.x)).toBeCloseTo(0.9649 - 0.0042 * Math.sqrt(t68), 6);
    expect(Math.max(...narrow.x)).toBeCloseTo(0.9649 + 0.0042 * Math.sqrt(t68), 6);
    expect(Math.max(...narrow.y)).toBeCloseTo((0.036 / 1.959964) * Math.sqrt(t68), 4);
    expect(Math.min(...wide.x)).toBeCloseTo(0.9649 - 0.0042 * Math.sqrt(6.1800743), 6);
    // Closed: the last vertex is the first.
    expect([narrow.x.at(-1), narrow.y.at(-1)]).toEqual([narrow.x[0], narrow.y[0]]);
  });

  it('draws every chosen set in its own colour, and frames the plot on their regions', () => {
    const figure = planeFigure({ series: [{ label: 'scan', plane: plane({ ns: [0.965], r: [0.01], pointIndex: [0] }) }], likelihoods: [planckBk, pact], rScale: 'linear', references: false });
    const regions = (figure.data as Trace[]).filter((t) => t.fillcolor);
    expect(regions.map((t) => t.name.split(':')[0])).toEqual([planckBk.name, pact.name, planckBk.name, pact.name]);
    expect(regions[1].fillcolor).toContain(SET_COLORS[1].rgb);
    // P-ACT-LB's n_s = 0.974 ± 0.003 reaches 0.974 + 0.003 √6.18 = 0.9815: inside the frame.
    const [, nsHigh] = figure.layout.xaxis!.range as number[];
    expect(nsHigh).toBeGreaterThan(0.974 + 0.003 * Math.sqrt(6.1800743));
  });

  it('judges each point by the set: Δχ² on hover and as a colour, saturating at 3σ', () => {
    // On r = 0, n_s one σ above the mean gives Δχ² = 1 and two σ gives 4 (Gaussian closed form);
    // 1 and 4 are the 39.3 % and 86.5 % regions in two parameters (1 − e^{−Δχ²/2}).
    const judged = plane({ ns: [0.9649, 0.9649 + 0.0042, 0.9649 + 2 * 0.0042], r: [0, 0, 0], alphaS: [0, 0, 0], pointIndex: [0, 1, 2] });
    const data = planeFigure({ series: [{ label: 'scan', plane: judged }], colorBy: 'deltaChi2', likelihoods, rScale: 'linear', references: false }).data as (Trace & { text: string[]; marker: { cmax?: number } })[];
    const points = data.at(-1)!;
    expect((points.marker.color as number[]).map((v) => Number(v.toFixed(9)))).toEqual([0, 1, 4]);
    expect(points.marker.cmax).toBeCloseTo(11.8292, 3);
    expect(points.text[1]).toContain('Δχ² = 1 under Planck 2018 + BICEP/Keck 2018 (39.3 % region)');
    expect(points.text[2]).toContain('(86.5 % region)');
  });

  it('draws no region while no set is chosen or loaded', () => {
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], likelihoods: [], rScale: 'linear', references: false }).data as Trace[];
    expect(data.map((t) => t.name)).toEqual(['scan']);
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
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], colorBy: 'f', likelihoods, rScale: 'linear', references: false }).data as Trace[];
    const points = data.at(-1)!;
    expect(points.marker?.color).toEqual([5, 7, 10]);
    expect(points.marker?.colorbar?.title?.text).toBe('f');
    expect(points.customdata).toEqual([[0, 0], [0, 4], [0, 8]]);
  });

  it('gives several scans a colour each and a legend entry by label', () => {
    const data = planeFigure({
      series: [{ label: 'first', plane: plane() }, { label: 'second', plane: plane({ pointIndex: [1, 2, 3] }) }],
      colorBy: 'f', likelihoods, rScale: 'log', references: true,
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
    const data = planeFigure({ series: [{ label: 'scan', plane: plane() }], likelihoods, rScale: 'linear', references: false, regions: [region] }).data as Trace[];
    const outline = data.find((t) => t.name === 'Survey A (68% CL, Invented survey DR2)')!;
    expect(regionLabel(region)).toBe('Survey A (68% CL, Invented survey DR2)');
    expect(outline.x).toEqual([0.95, 0.97, 0.96, 0.95]);
    expect(outline.y).toEqual([0, 0, 0.04, 0]);
    expect(data.at(-1)!.name).toBe('scan');
  });
});
