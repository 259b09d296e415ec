import type { GroupRole, ModelParameter, SiteRole } from '@sixtyfold/shared';

/**
 * The invented demo scenario: one institute, two research groups, a user for each role.
 * Every demo account shares one password so the README can list them in a line.
 */
export const DEMO_INSTITUTE = 'Halvorsen Institute for Theoretical Cosmology';
export const DEMO_PASSWORD = 'inflaton-demo-1';

export interface DemoUser {
  email: string;
  displayName: string;
  siteRole: SiteRole;
  /** What the person does, for the printed list of accounts. */
  part: string;
  memberships: { group: string; role: GroupRole }[];
}

export interface DemoGroup {
  slug: string;
  name: string;
  description: string;
}

export interface DemoModel {
  group: string;
  name: string;
  expression: string;
  parameters: ModelParameter[];
  phiInit: number | null;
  description: string;
  createdBy: string;
}

export const DEMO_GROUPS: DemoGroup[] = [
  {
    slug: 'plateau-models',
    name: 'Plateau Models',
    description: `${DEMO_INSTITUTE}: plateau and attractor potentials against the latest n_s limits.`,
  },
  {
    slug: 'tensor-modes',
    name: 'Tensor Modes',
    description: `${DEMO_INSTITUTE}: large-field models and the tensor-to-scalar ratio.`,
  },
];

export const DEMO_USERS: DemoUser[] = [
  { email: 'amara.okafor@halvorsen.example', displayName: 'Amara Okafor', siteRole: 'admin', part: 'site maintainer', memberships: [] },
  { email: 'henrik.solberg@halvorsen.example', displayName: 'Henrik Solberg', siteRole: 'user', part: 'PI, Plateau Models', memberships: [{ group: 'plateau-models', role: 'lead' }] },
  { email: 'lucia.marin@halvorsen.example', displayName: 'Lucía Marín', siteRole: 'user', part: 'postdoc, Plateau Models', memberships: [{ group: 'plateau-models', role: 'member' }] },
  { email: 'tomas.reyes@halvorsen.example', displayName: 'Tomás Reyes', siteRole: 'user', part: 'student, Plateau Models', memberships: [{ group: 'plateau-models', role: 'viewer' }] },
  { email: 'mei.nakamura@halvorsen.example', displayName: 'Mei Nakamura', siteRole: 'user', part: 'PI, Tensor Modes', memberships: [{ group: 'tensor-modes', role: 'lead' }] },
  { email: 'jonas.weber@halvorsen.example', displayName: 'Jonas Weber', siteRole: 'user', part: 'postdoc, Tensor Modes', memberships: [{ group: 'tensor-modes', role: 'member' }] },
  { email: 'priya.raman@halvorsen.example', displayName: 'Priya Raman', siteRole: 'user', part: 'student, Tensor Modes', memberships: [{ group: 'tensor-modes', role: 'viewer' }] },
];

export const DEMO_MODELS: DemoModel[] = [
  {
    group: 'plateau-models',
    name: 'Plateau with a Gaussian bump',
    expression: 'V0 * (1 - exp(-sqrt(2 / (3 * alpha)) * phi))^2 * (1 + A * exp(-(phi - phi0)^2 / (2 * sigma^2)))',
    parameters: [
      { name: 'V0', defaultValue: 1e-10, min: 1e-14, max: 1e-8, description: 'overall scale' },
      { name: 'alpha', defaultValue: 1, min: 0.1, max: 10, description: 'curvature of the field space' },
      { name: 'A', defaultValue: 1e-3, min: 0, max: 0.05, description: 'height of the bump' },
      { name: 'phi0', defaultValue: 5, min: 3, max: 7, description: 'position of the bump' },
      { name: 'sigma', defaultValue: 0.1, min: 0.01, max: 1, description: 'width of the bump' },
    ],
    phiInit: 7.5,
    description: 'A plateau potential with a small localised feature, to see how far a bump moves n_s and its running.',
    createdBy: 'lucia.marin@halvorsen.example',
  },
  {
    group: 'tensor-modes',
    name: 'Quadratic with a log correction',
    expression: '0.5 * m^2 * phi^2 * (1 + c * log(phi^2))',
    parameters: [
      { name: 'm', defaultValue: 6e-6, min: 1e-7, max: 1e-4, description: 'inflaton mass' },
      { name: 'c', defaultValue: 0.005, min: -0.02, max: 0.02, description: 'size of the radiative correction' },
    ],
    phiInit: 17,
    description: 'A quadratic potential bent by a one-loop-like logarithm; lowers r for negative c.',
    createdBy: 'jonas.weber@halvorsen.example',
  },
];
