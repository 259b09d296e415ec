import type { ConstraintRegion } from '@sixtyfold/shared';

/** 0.95 → "95% CL". */
export const confidenceLabel = (level: number) => `${+(level * 100).toFixed(2)}% CL`;

/** "Name (95% CL, source)": how a region is named in the legend and the toggles. */
export function regionLabel(region: Pick<ConstraintRegion, 'name' | 'confidenceLevel' | 'source'>): string {
  return `${region.name} (${confidenceLabel(region.confidenceLevel)}, ${region.source})`;
}
