import type { PotentialModel } from '@sixtyfold/shared';

// A model of the invented Plateau Lab, for the specs of the models pages. Short on purpose:
// pages parse and differentiate the expression, which takes seconds for long ones in happy-dom.
export const logModel: PotentialModel = {
  id: 7,
  groupId: 10,
  name: 'Quadratic with a log correction',
  expression: '0.5 * m^2 * phi^2 * (1 + c * log(phi^2))',
  parameters: [
    { name: 'm', defaultValue: 6e-6, min: 1e-7, max: 1e-4, description: 'inflaton mass' },
    { name: 'c', defaultValue: 0.005, min: -0.02, max: 0.02, description: 'size of the radiative correction' },
  ],
  phiInit: 17,
  description: 'A quadratic potential bent by a one-loop-like logarithm.',
  createdById: 2,
  createdAt: '2026-11-02T10:00:00.000Z',
  updatedAt: '2026-11-20T16:30:00.000Z',
};
