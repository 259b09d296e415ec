import type { ScanMethod } from '@sixtyfold/shared';

export const methodLabels: Record<ScanMethod, string> = {
  slowroll: 'Slow-roll',
  exact: 'Mode equation',
};
