import { createScanSchema, PIVOT_AXES, type ScanDetail, type StoredScanSpec } from '@sixtyfold/shared';

/**
 * The scan's stored specification, read with the same schema that accepted it. Null when this
 * version of the app cannot read it (a spec written by a newer API, say), so pages can say so.
 */
export function storedSpecOf(scan: Pick<ScanDetail, 'spec'>): StoredScanSpec | null {
  const parsed = createScanSchema.safeParse(scan.spec);
  const source = scan.spec.potentialSource;
  if (!parsed.success || typeof source !== 'string') return null;
  return { ...parsed.data, potentialSource: source };
}

/** True for the axes that set N_* rather than a parameter of the potential. */
export const isPivotAxis = (parameter: string) => (PIVOT_AXES as readonly string[]).includes(parameter);
