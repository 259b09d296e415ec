import type { ModelParameter } from '../../schemas/potential-model.schema.js';
import type { PotentialScale } from '../expression/detect-scale.js';
import type { PotentialFunctions } from '../types.js';
import { slowRollStart } from './start-point.js';

/** A published family of potentials, written in the same expression syntax users type. */
export interface PotentialFamily {
  key: string;
  name: string;
  /** math.js expression in phi and the parameters (reduced Planck units). */
  expression: string;
  parameters: ModelParameter[];
  /** Where it inflates and which way the field rolls. */
  region: string;
  /** The paper the family comes from. */
  reference: string;
  /** False for families in which inflation never ends by itself. */
  endsInflation: boolean;
  /** A start about `efolds` (default 75) slow-roll e-folds before the end, from the parameters. */
  phiInit(params: Record<string, number>, potential: PotentialFunctions, efolds?: number): number;
  /** The parameters that start depends on (the overall scale never matters), so it can be reused. */
  startDependsOn: string[];
  /**
   * The parameter that only scales V, as V ∝ parameter^power: in e-folds the background does not
   * see it, so points that differ only in it share one computation (`RequestEvaluator`).
   */
  scale?: PotentialScale;
}

/** Slow-roll e-folds of a family's default start; the engine moves further up when a point needs more. */
export const START_EFOLDS = 75;
const p = (name: string, defaultValue: number, min: number, max: number, description: string): ModelParameter => ({
  name, defaultValue, min, max, description,
});

export const POTENTIAL_FAMILIES: PotentialFamily[] = [
  {
    key: 'monomial',
    scale: { parameter: 'lambda', power: 1 },
    startDependsOn: ['p'],
    name: 'Monomial (chaotic) inflation',
    expression: 'lambda * phi^p',
    parameters: [p('lambda', 1e-10, 1e-16, 1e-4, 'overall scale (fixed by A_s)'), p('p', 2, 0.1, 6, 'power of the field')],
    region: 'large field, φ > 0, rolling towards φ = 0',
    reference: 'Linde 1983, Phys. Lett. B 129, 177 (chaotic inflation)',
    endsInflation: true,
    // Slow roll: N = (φ² − φ_end²)/(2p) with φ_end = p/√2.
    phiInit: ({ p: power }, _potential, efolds = START_EFOLDS) => Math.sqrt(2 * power * efolds + (power * power) / 2),
  },
  {
    key: 'quadratic-quartic',
    startDependsOn: [],
    name: 'Quadratic plus quartic',
    expression: '0.5 * m^2 * phi^2 + lambda4 / 4 * phi^4',
    parameters: [p('m', 6e-6, 1e-8, 1e-3, 'inflaton mass'), p('lambda4', 1e-14, 0, 1e-8, 'quartic self-coupling')],
    region: 'large field, φ > 0, rolling towards φ = 0',
    reference: 'Linde 1983, Phys. Lett. B 129, 177; the two-term form as in Planck 2018 X, arXiv:1807.06211',
    endsInflation: true,
    // V/V' ≥ φ/4 for both terms, so φ² = 8N + 8 gives at least N e-folds.
    phiInit: (_params, _potential, efolds = START_EFOLDS) => Math.sqrt(8 * efolds + 8),
  },
  {
    key: 'starobinsky',
    scale: { parameter: 'mu', power: 2 },
    startDependsOn: [],
    name: 'Starobinsky R² (Einstein frame)',
    expression: '0.75 * mu^2 * (1 - exp(-sqrt(2/3) * phi))^2',
    parameters: [p('mu', 1.3e-5, 1e-8, 1e-2, 'scalaron mass')],
    region: 'plateau at large φ > 0, rolling towards φ = 0',
    reference: 'Starobinsky 1980, Phys. Lett. B 91, 99',
    endsInflation: true,
    phiInit: (_params, V, efolds = START_EFOLDS) => slowRollStart(V, 5, 0.01, efolds),
  },
  {
    key: 'natural',
    scale: { parameter: 'Lambda', power: 4 },
    startDependsOn: ['f'],
    name: 'Natural inflation',
    expression: 'Lambda^4 * (1 + cos(phi / f))',
    parameters: [p('Lambda', 5e-3, 1e-6, 1e-1, 'scale of the axion potential'), p('f', 7, 0.5, 100, 'axion decay constant')],
    region: '0 < φ < πf, rolling from near the top (φ = 0) towards the minimum at φ = πf',
    reference: 'Freese, Frieman & Olinto 1990, Phys. Rev. Lett. 65, 3233',
    endsInflation: true,
    // Slow roll: N = 2f² ln[sin(x_end/2)/sin(x/2)], x = φ/f, tan(x_end/2) = √2 f.
    phiInit: ({ f }, _potential, efolds = START_EFOLDS) => {
      const xEnd = 2 * Math.atan(Math.SQRT2 * f);
      return 2 * f * Math.asin(Math.sin(xEnd / 2) * Math.exp(-efolds / (2 * f * f)));
    },
  },
  {
    key: 'hilltop-quadratic',
    scale: { parameter: 'V0', power: 1 },
    startDependsOn: ['mu'],
    name: 'Hilltop, quadratic',
    expression: 'V0 * (1 - phi^2 / mu^2)',
    parameters: [p('V0', 1e-10, 1e-20, 1e-4, 'height of the hilltop'), p('mu', 10, 0.5, 100, 'field scale of the hilltop')],
    region: '0 < φ < μ, rolling away from the maximum at φ = 0',
    reference: 'Boubekeur & Lyth 2005, JCAP 07, 010 (hep-ph/0502047)',
    endsInflation: true,
    phiInit: ({ mu }, V, efolds = START_EFOLDS) => slowRollStart(V, 1e-6 * mu, mu * (1 - 1e-12), efolds),
  },
  {
    key: 'hilltop-quartic',
    scale: { parameter: 'V0', power: 1 },
    startDependsOn: ['mu'],
    name: 'Hilltop, quartic',
    expression: 'V0 * (1 - phi^4 / mu^4)',
    parameters: [p('V0', 1e-10, 1e-20, 1e-4, 'height of the hilltop'), p('mu', 10, 0.05, 100, 'field scale of the hilltop')],
    region: '0 < φ < μ, rolling away from the maximum at φ = 0',
    reference: 'Boubekeur & Lyth 2005, JCAP 07, 010 (hep-ph/0502047); Kohri, Lin & Lyth 2007, arXiv:0707.3826',
    endsInflation: true,
    phiInit: ({ mu }, V, efolds = START_EFOLDS) => slowRollStart(V, 1e-6 * mu, mu * (1 - 1e-12), efolds),
  },
  {
    key: 'alpha-t',
    scale: { parameter: 'V0', power: 1 },
    startDependsOn: ['alpha', 'n'],
    name: 'α-attractor, T-model',
    expression: 'V0 * tanh(phi / sqrt(6 * alpha))^(2 * n)',
    parameters: [p('V0', 1e-10, 1e-20, 1e-4, 'plateau height'), p('alpha', 1, 0.01, 100, 'α (curvature of the Kähler geometry)'), p('n', 1, 0.5, 4, 'power')],
    region: 'plateau at large φ > 0, rolling towards φ = 0',
    reference: 'Kallosh & Linde 2013, JCAP 07, 002 (arXiv:1306.5220); Kallosh, Linde & Roest 2013, JHEP 11, 198 (arXiv:1311.0472)',
    endsInflation: true,
    phiInit: ({ alpha }, V, efolds = START_EFOLDS) => slowRollStart(V, 30 * Math.sqrt(alpha), 1e-6, efolds),
  },
  {
    key: 'alpha-e',
    scale: { parameter: 'V0', power: 1 },
    startDependsOn: ['alpha', 'n'],
    name: 'α-attractor, E-model',
    expression: 'V0 * (1 - exp(-sqrt(2 / (3 * alpha)) * phi))^(2 * n)',
    parameters: [p('V0', 1e-10, 1e-20, 1e-4, 'plateau height'), p('alpha', 1, 0.01, 100, 'α (α = n = 1 is Starobinsky)'), p('n', 1, 0.5, 4, 'power')],
    region: 'plateau at large φ > 0, rolling towards φ = 0',
    reference: 'Kallosh, Linde & Roest 2013, JHEP 11, 198 (arXiv:1311.0472)',
    endsInflation: true,
    phiInit: ({ alpha }, V, efolds = START_EFOLDS) => slowRollStart(V, 30 * Math.sqrt(alpha), 1e-6, efolds),
  },
  {
    key: 'double-well',
    scale: { parameter: 'lambda', power: 1 },
    startDependsOn: ['v'],
    name: 'Double well (symmetry breaking)',
    expression: 'lambda / 4 * (phi^2 - v^2)^2',
    parameters: [p('lambda', 1e-14, 1e-20, 1e-4, 'self-coupling'), p('v', 20, 1, 200, 'vacuum expectation value')],
    region: '0 < φ < v, rolling from near the maximum at φ = 0 towards the minimum at φ = v',
    reference: 'Vilenkin 1983 and Linde 1983 (new inflation from symmetry breaking); as in Planck 2018 X, arXiv:1807.06211',
    endsInflation: true,
    phiInit: ({ v }, V, efolds = START_EFOLDS) => slowRollStart(V, 1e-6 * v, v * (1 - 1e-12), efolds),
  },
  {
    key: 'power-law',
    scale: { parameter: 'V0', power: 1 },
    startDependsOn: [],
    name: 'Power-law (exponential potential)',
    expression: 'V0 * exp(-lambda * phi)',
    parameters: [p('V0', 1e-10, 1e-20, 1e-4, 'scale'), p('lambda', 0.1, 0.001, 1.4, 'slope; ε = λ²/2')],
    region: 'any φ, rolling towards larger φ; for λ < √2 inflation never ends by itself',
    reference: 'Lucchin & Matarrese 1985, Phys. Rev. D 32, 1316',
    endsInflation: false,
    phiInit: () => 0,
  },
  {
    key: 'monodromy-modulated',
    startDependsOn: [],
    name: 'Linear monodromy with modulations',
    expression: 'mu3 * phi + Lambda4 * cos(phi / f)',
    parameters: [
      p('mu3', 1e-10, 1e-20, 1e-4, 'slope of the linear potential'),
      p('Lambda4', 1e-13, 0, 1e-4, 'amplitude of the modulation'),
      p('f', 0.1, 1e-4, 10, 'period of the modulation / 2π'),
    ],
    region: 'φ > 0, rolling towards φ = 0; local minima appear where Λ⁴ > μ³ f',
    reference: 'McAllister, Silverstein & Westphal 2010, Phys. Rev. D 82, 046003 (arXiv:0808.0706); Flauger et al. 2010, JCAP 06, 009 (arXiv:0907.2916)',
    endsInflation: true,
    // Linear slow roll: N = (φ² − φ_end²)/2 with φ_end = 1/√2.
    phiInit: (_params, _potential, efolds = START_EFOLDS) => Math.sqrt(2 * efolds + 0.5),
  },
];

export function findFamily(key: string): PotentialFamily | undefined {
  return POTENTIAL_FAMILIES.find((f) => f.key === key);
}
